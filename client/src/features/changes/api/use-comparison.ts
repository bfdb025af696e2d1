import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { RESULT_BANDS } from '@shared/api';
import { CHANGE_KINDS } from '@shared/compare/compare-revisions';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

const comparableSchema = z.object({
  globalId: z.string(),
  tag: z.string().nullable(),
  name: z.string().nullable(),
  profile: z.string().nullable(),
  grade: z.string().nullable(),
  holeSignature: z.string(),
  designForceN: z.number().nullable(),
  utilisation: z.number().nullable(),
  band: z.enum(RESULT_BANDS),
});

const changeKind = z.enum(CHANGE_KINDS);

/** GET …/comparison?with=… (shapes from shared/compare/compare-revisions.ts). */
export const comparisonSchema = z.object({
  before: z.object({ id: z.number().int(), number: z.number().int() }),
  after: z.object({ id: z.number().int(), number: z.number().int() }),
  matchedByGlobalId: z.number().int(),
  matchedByTag: z.number().int(),
  counts: z.record(changeKind, z.number().int()),
  changes: z.array(
    z.object({
      globalId: z.string(),
      previousGlobalId: z.string().nullable(),
      tag: z.string().nullable(),
      name: z.string().nullable(),
      kinds: z.array(changeKind),
      before: comparableSchema.nullable(),
      after: comparableSchema.nullable(),
    }),
  ),
  warnings: z.array(z.string()),
});
export type Comparison = z.infer<typeof comparisonSchema>;
export type ComparisonChange = Comparison['changes'][number];

const comparisonPath = (projectId: number, revisionId: number) => apiPath`/api/projects/${projectId}/revisions/${revisionId}/comparison`;

export async function fetchComparison(projectId: number, revisionId: number, withRevisionId: number, signal?: AbortSignal): Promise<Comparison> {
  return api.get(`${comparisonPath(projectId, revisionId)}?with=${encodeURIComponent(String(withRevisionId))}`, comparisonSchema, { signal });
}

/** The changes from an earlier revision to this one; `withRevisionId` null waits. */
export function useComparison(projectId: number, revisionId: number, withRevisionId: number | null) {
  return useQuery({
    queryKey: queryKeys.comparison(projectId, revisionId, withRevisionId ?? 0),
    queryFn: ({ signal }) => fetchComparison(projectId, revisionId, withRevisionId as number, signal),
    enabled: withRevisionId !== null,
  });
}

/** Where the CSV of the same comparison downloads from. */
export function comparisonCsvHref(projectId: number, revisionId: number, withRevisionId: number): string {
  return `${comparisonPath(projectId, revisionId)}?with=${encodeURIComponent(String(withRevisionId))}&format=csv`;
}
