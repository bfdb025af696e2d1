import { z } from 'zod';

/** Import job states, in order; `failed` can follow any of the working states. */
export const JOB_STATUSES = ['queued', 'reading', 'extracting', 'checking', 'done', 'failed'] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];
export const JOB_STATUS_LABELS: Record<JobStatus, string> = {
  queued: 'Waiting in line',
  reading: 'Reading the file',
  extracting: 'Finding members, bolts and holes',
  checking: 'Checking members',
  done: 'Checked',
  failed: 'Could not be checked',
};
export const isJobFinished = (s: JobStatus) => s === 'done' || s === 'failed';

export const importWarningSchema = z.object({
  code: z.string(),
  message: z.string(),
  count: z.number().int(),
  examples: z.array(z.string()),
});
export type ImportWarning = z.infer<typeof importWarningSchema>;

export const revisionSummarySchema = z.object({
  schema: z.string().nullable(),
  lengthUnit: z.string().nullable(),
  candidates: z.number().int(),
  tensionMembers: z.number().int(),
  checked: z.number().int(),
  withoutForce: z.number().int(),
  boltGroups: z.number().int(),
  holes: z.number().int(),
  countsByClass: z.record(z.string(), z.number().int()),
  warnings: z.array(importWarningSchema),
  timings: z.record(z.string(), z.number()).optional(),
  /** The 3D view's geometry: built after the results are stored. */
  geometry: z.enum(['pending', 'ready', 'failed']).optional(),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;

export const revisionSchema = z.object({
  id: z.number().int(),
  modelId: z.number().int(),
  number: z.number().int(),
  fileName: z.string(),
  fileSize: z.number().int(),
  sha256: z.string(),
  standard: z.string(),
  status: z.enum(JOB_STATUSES),
  progress: z.number(),
  failure: z.object({ error: z.string(), message: z.string() }).nullable(),
  uploadedBy: z.string().nullable(),
  summary: revisionSummarySchema.nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type Revision = z.infer<typeof revisionSchema>;

export const ifcModelSchema = z.object({
  id: z.number().int(),
  projectId: z.number().int(),
  name: z.string(),
  latestRevision: revisionSchema.nullable(),
  revisionCount: z.number().int(),
});
export type IfcModel = z.infer<typeof ifcModelSchema>;
export const ifcModelListSchema = z.object({ models: z.array(ifcModelSchema) });
export const revisionListSchema = z.object({ revisions: z.array(revisionSchema) });

/** Response of an upload: the revision made, or the earlier one with identical bytes. */
export const uploadResponseSchema = z.object({
  revision: revisionSchema,
  duplicateOf: z.number().int().nullable(),
});
export type UploadResponse = z.infer<typeof uploadResponseSchema>;

export const MODEL_NAME_MAX = 160;
export const uploadFieldsSchema = z.object({
  modelName: z.string().trim().min(1, 'Name the model').max(MODEL_NAME_MAX).optional(),
});
