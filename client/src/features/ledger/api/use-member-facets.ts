import { useQuery } from '@tanstack/react-query';
import { fetchMemberPage } from './use-member-page';
import { queryKeys } from '../../../lib/query-keys';

/**
 * Values to offer in the class and profile filters, read from the first 500 members
 * of the revision (every candidate). Large models may have more; the profile filter
 * still takes any typed value.
 */
export function useMemberFacets(projectId: number, revisionId: number) {
  const params = { scope: 'all', pageSize: '500', sort: 'profile', dir: 'asc', facets: '1' };
  return useQuery({
    queryKey: queryKeys.results.members(projectId, revisionId, params),
    queryFn: async ({ signal }) => {
      const { facets: _f, ...query } = params;
      const page = await fetchMemberPage(projectId, revisionId, query, signal);
      const classes = [...new Set(page.members.map((m) => m.ifcClass))].sort();
      const profiles = [...new Set(page.members.map((m) => m.profile).filter((p): p is string => !!p))].sort();
      return { classes, profiles, complete: page.total <= page.members.length };
    },
    staleTime: 5 * 60_000,
  });
}
