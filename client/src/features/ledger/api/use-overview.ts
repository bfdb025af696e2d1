import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { memberRowSchema, RESULT_BANDS, type ResultBand } from '@shared/api';
import type { RevisionOverview } from '@shared/api/member-sheet';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

// The shared type has no schema; this one checks the answer has the shape we draw from.
const overviewSchema: z.ZodType<RevisionOverview> = z.object({
  total: z.number(),
  bands: z.object(Object.fromEntries(RESULT_BANDS.map((b) => [b, z.number()])) as Record<ResultBand, z.ZodNumber>),
  histogram: z.array(z.object({ from: z.number(), to: z.number().nullable(), count: z.number() })),
  critical: z.array(memberRowSchema),
});

/** GET …/revisions/:rid/overview: counts per band, the utilisation histogram, the most critical members. */
export function useOverview(projectId: number, revisionId: number) {
  return useQuery({
    queryKey: queryKeys.results.overview(projectId, revisionId),
    queryFn: ({ signal }) => api.get(apiPath`/api/projects/${projectId}/revisions/${revisionId}/overview`, overviewSchema, { signal }),
  });
}
