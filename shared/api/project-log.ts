import { z } from 'zod';

/**
 * The project log (GET /api/projects/:projectId/audit): who uploaded, overrode, exported
 * or mailed what, and when. Entries are grouped into kinds by the first word of their
 * action ("export.created" is an export), so new actions of a kind need no change here.
 */
export const PROJECT_LOG_KINDS = ['upload', 'override', 'forces', 'export', 'mail', 'project'] as const;
export type ProjectLogKind = (typeof PROJECT_LOG_KINDS)[number];

/** The action prefix each kind stands for (actions are "<prefix>.<verb>"). */
export const PROJECT_LOG_ACTION_PREFIX: Record<ProjectLogKind, string> = {
  upload: 'model',
  override: 'member',
  forces: 'forces',
  export: 'export',
  mail: 'mail',
  project: 'project',
};

export const PROJECT_LOG_KIND_LABELS: Record<ProjectLogKind, string> = {
  upload: 'Uploads',
  override: 'Member overrides',
  forces: 'Forces tables',
  export: 'Exports',
  mail: 'Mail sent',
  project: 'Project settings and people',
};

/** The kind of an action, or null for an action of no listed kind. */
export function projectLogKindOf(action: string): ProjectLogKind | null {
  const prefix = action.slice(0, action.indexOf('.'));
  return PROJECT_LOG_KINDS.find((k) => PROJECT_LOG_ACTION_PREFIX[k] === prefix) ?? null;
}

/** Query of GET /api/projects/:projectId/audit: newest first, paged, optionally one kind. */
export const projectLogQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  kind: z.enum(PROJECT_LOG_KINDS).optional(),
});
export type ProjectLogQuery = z.input<typeof projectLogQuerySchema>;

export const projectLogEntrySchema = z.object({
  id: z.number().int(),
  /** ISO 8601. */
  at: z.string(),
  /** Null when Gaugeline itself acted (or the person's account is gone). */
  by: z.object({ name: z.string(), email: z.string() }).nullable(),
  action: z.string(),
  kind: z.enum(PROJECT_LOG_KINDS).nullable(),
  /** What the entry is about, in words: e.g. "Shed, revision 2" or "member 2O2Fr$t4X7Zf8NOew3FLOH in Shed, revision 2". */
  subject: z.string(),
  /** Revision number and member GlobalId where the subject has them. */
  revisionNumber: z.number().int().nullable(),
  globalId: z.string().nullable(),
  detail: z.record(z.string(), z.unknown()),
  reason: z.string().nullable(),
});
export type ProjectLogEntry = z.infer<typeof projectLogEntrySchema>;

export const projectLogPageSchema = z.object({
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  entries: z.array(projectLogEntrySchema),
});
export type ProjectLogPage = z.infer<typeof projectLogPageSchema>;
