import { useQuery } from '@tanstack/react-query';
import { memberPageSchema, type MemberRow } from '@shared/api';
import { api } from '../../../lib/api-client';

const PAGE_SIZE = 500;
const PARALLEL = 6;

/** Under the revision's results key, so changes to results (forces, overrides) refresh the colours too. */
export const allMembersKey = (projectId: number, revisionId: number) => ['results', projectId, revisionId, 'model-view', 'all-members'] as const;

/** Every candidate member of a revision (scope=all), page by page, several pages at a time. */
export async function fetchAllMembers(projectId: number, revisionId: number, signal?: AbortSignal): Promise<MemberRow[]> {
  const page = (n: number) => api.get(`/api/projects/${projectId}/revisions/${revisionId}/members?scope=all&pageSize=${PAGE_SIZE}&page=${n}&sort=globalId&dir=asc`, memberPageSchema, { signal });
  const first = await page(1);
  const pages = Math.ceil(first.total / PAGE_SIZE);
  const rest: MemberRow[][] = new Array(Math.max(0, pages - 1));
  let next = 2;
  const worker = async () => {
    while (next <= pages) {
      const n = next++;
      rest[n - 2] = (await page(n)).members;
    }
  };
  await Promise.all(Array.from({ length: Math.min(PARALLEL, pages - 1) }, worker));
  return [...first.members, ...rest.flat()];
}

export function useAllMembers(projectId: number, revisionId: number) {
  return useQuery({
    queryKey: allMembersKey(projectId, revisionId),
    queryFn: ({ signal }) => fetchAllMembers(projectId, revisionId, signal),
  });
}
