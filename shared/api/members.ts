import { z } from 'zod';
import { RESULT_BANDS } from './results';

/** One row of the member table. Forces N, capacities N, areas mm², lengths mm. */
export const memberRowSchema = z.object({
  globalId: z.string(),
  tag: z.string().nullable(),
  name: z.string().nullable(),
  ifcClass: z.string(),
  storey: z.string().nullable(),
  assembly: z.string().nullable(),
  profile: z.string().nullable(),
  grade: z.string().nullable(),
  lengthMm: z.number().nullable(),
  isTension: z.boolean(),
  inclusion: z.enum(['auto', 'included', 'excluded']),
  holeCount: z.number().int(),
  designForceN: z.number().nullable(),
  forceSource: z.string().nullable(),
  netAreaMm2: z.number().nullable(),
  designCapacityN: z.number().nullable(),
  utilisation: z.number().nullable(),
  governing: z.string().nullable(),
  band: z.enum(RESULT_BANDS),
  warningCount: z.number().int(),
});
export type MemberRow = z.infer<typeof memberRowSchema>;

export const MEMBER_SORT_KEYS = ['utilisation', 'globalId', 'tag', 'name', 'ifcClass', 'profile', 'grade', 'designForceN', 'designCapacityN', 'governing', 'warningCount'] as const;
export type MemberSortKey = (typeof MEMBER_SORT_KEYS)[number];

const csv = <T extends string>(values: readonly [T, ...T[]]) =>
  z
    .string()
    .transform((s) => s.split(',').map((v) => v.trim()).filter(Boolean))
    .pipe(z.array(z.enum(values)));

/** Query of GET …/revisions/:id/members (server-side paging, sorting, filtering, search). */
export const memberQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
  sort: z.enum(MEMBER_SORT_KEYS).default('utilisation'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  band: csv(RESULT_BANDS).optional(),
  minUtilisation: z.coerce.number().min(0).max(100).optional(),
  ifcClass: z.string().max(60).optional(),
  storey: z.string().max(160).optional(),
  assembly: z.string().max(160).optional(),
  profile: z.string().max(120).optional(),
  /** Free text over GlobalId, tag, name and profile. */
  q: z.string().max(120).optional(),
  /** `tension` (default): tension members and members included by hand; `all`: every candidate. */
  scope: z.enum(['tension', 'all']).default('tension'),
  /** Comma-separated GlobalIds (selection from the 3D view). */
  ids: z.string().max(20_000).optional(),
});
export type MemberQuery = z.input<typeof memberQuerySchema>;

export const memberPageSchema = z.object({
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  members: z.array(memberRowSchema),
});
export type MemberPage = z.infer<typeof memberPageSchema>;

/** Body of POST …/revisions/:id/forces. */
export const forcesUploadSchema = z.object({ csv: z.string().min(1, 'The forces file is empty').max(20_000_000) });
export const forcesReportSchema = z.object({ unit: z.string(), rows: z.number().int(), members: z.number().int(), rechecked: z.number().int() });
export type ForcesReportBody = z.infer<typeof forcesReportSchema>;
