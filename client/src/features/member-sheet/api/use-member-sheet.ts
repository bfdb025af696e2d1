import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { MemberSheet } from '@shared/api/member-sheet';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

// The sheet is typed in shared/api (no schema there); check the parts every view relies on.
const sheetSchema = z
  .object({
    revision: z.object({ id: z.number(), number: z.number(), standard: z.string(), fileName: z.string() }),
    member: z.object({ globalId: z.string() }).loose(),
    detail: z.object({ ends: z.array(z.unknown()), warnings: z.array(z.string()) }).loose(),
    forces: z.array(z.object({ loadCase: z.string(), axialN: z.number(), source: z.string() })),
    result: z.object({ trace: z.array(z.unknown()), modes: z.array(z.unknown()), assumptions: z.array(z.unknown()) }).loose().nullable(),
    cautions: z.array(z.string()),
  })
  .loose() as unknown as z.ZodType<MemberSheet>;

/** GET …/revisions/:rid/members/:globalId: everything the member sheet shows. */
export function useMemberSheet(projectId: number, revisionId: number, globalId: string) {
  return useQuery({
    queryKey: queryKeys.results.sheet(projectId, revisionId, globalId),
    queryFn: ({ signal }) => api.get(apiPath`/api/projects/${projectId}/revisions/${revisionId}/members/${globalId}`, sheetSchema, { signal }),
  });
}
