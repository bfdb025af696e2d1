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
  models: {
    /** Everything about one project's models and revisions. */
    ofProject: (projectId: number) => ['models', projectId] as const,
    list: (projectId: number) => ['models', projectId, 'list'] as const,
    revisions: (projectId: number, modelId: number) => ['models', projectId, 'revisions', modelId] as const,
    revision: (projectId: number, revisionId: number) => ['models', projectId, 'revision', revisionId] as const,
  },
  /** Results of one revision: table pages, overview, member sheets and their audit trails. */
  results: {
    ofRevision: (projectId: number, revisionId: number) => ['results', projectId, revisionId] as const,
    members: (projectId: number, revisionId: number, query: Record<string, string>) => ['results', projectId, revisionId, 'members', query] as const,
    overview: (projectId: number, revisionId: number) => ['results', projectId, revisionId, 'overview'] as const,
    sheet: (projectId: number, revisionId: number, globalId: string) => ['results', projectId, revisionId, 'sheet', globalId] as const,
    audit: (projectId: number, revisionId: number, globalId: string) => ['results', projectId, revisionId, 'sheet', globalId, 'audit'] as const,
  },
  users: {
    all: ['users'] as const,
    list: () => ['users', 'list'] as const,
  },
  /** The outbox (admins). */
  mail: {
    all: ['mail'] as const,
    list: () => ['mail', 'list'] as const,
    message: (mailId: number) => ['mail', 'message', mailId] as const,
  },
  /** The project log (engineers and admins): pages by kind. */
  projectLog: {
    ofProject: (projectId: number) => ['project-log', projectId] as const,
    page: (projectId: number, query: Record<string, string>) => ['project-log', projectId, query] as const,
  },
  /** What changed between two revisions. */
  comparison: (projectId: number, revisionId: number, withRevisionId: number) => ['results', projectId, revisionId, 'comparison', withRevisionId] as const,
};
