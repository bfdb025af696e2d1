/**
 * Query keys shared across features, so that one feature's change can refresh
 * another's data without importing it (e.g. adding someone to a project
 * refreshes that project's member list wherever it is shown).
 */
export const queryKeys = {
  session: ['session'] as const,
  projects: {
    all: ['projects'] as const,
    list: () => ['projects', 'list'] as const,
    detail: (projectId: number) => ['projects', 'detail', projectId] as const,
    members: (projectId: number) => ['projects', 'detail', projectId, 'members'] as const,
  },
  users: {
    all: ['users'] as const,
    list: () => ['users', 'list'] as const,
  },
};
