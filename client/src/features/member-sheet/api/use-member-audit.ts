import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { MemberAuditEntry } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

const auditSchema = z.object({
  entries: z.array(
    z.object({
      at: z.string(),
      by: z.string().nullable(),
      action: z.string(),
      change: z.record(z.string(), z.object({ before: z.unknown(), after: z.unknown() })),
      reason: z.string().nullable(),
    }),
  ),
}) as unknown as z.ZodType<{ entries: MemberAuditEntry[] }>;

/** GET …/members/:globalId/audit: who changed what on this member, newest first. */
export function useMemberAudit(projectId: number, revisionId: number, globalId: string) {
  return useQuery({
    queryKey: queryKeys.results.audit(projectId, revisionId, globalId),
    queryFn: async ({ signal }) => (await api.get(apiPath`/api/projects/${projectId}/revisions/${revisionId}/members/${globalId}/audit`, auditSchema, { signal })).entries,
  });
}
