/** Every client route in one place, so links and the router agree. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  /** Where e-mailed one-time links land (the token travels in the URL fragment). */
  setPassword: '/set-password',
  account: '/account',
  about: '/about',
  project: (projectId: number | string) => `/projects/${encodeURIComponent(String(projectId))}`,
  /** A revision's results; `search` is an optional query string without "?". */
  revision: (projectId: number | string, revisionId: number | string, search?: string) =>
    `/projects/${encodeURIComponent(String(projectId))}/revisions/${encodeURIComponent(String(revisionId))}${search ? `?${search}` : ''}`,
  /** One member's sheet, keyed by its IFC GlobalId. */
  member: (projectId: number | string, revisionId: number | string, globalId: string) =>
    `/projects/${encodeURIComponent(String(projectId))}/revisions/${encodeURIComponent(String(revisionId))}/members/${encodeURIComponent(globalId)}`,
  /** What changed in a revision since an earlier one (`withRevisionId`), member by member. */
  revisionChanges: (projectId: number | string, revisionId: number | string, withRevisionId?: number | string) =>
    `/projects/${encodeURIComponent(String(projectId))}/revisions/${encodeURIComponent(String(revisionId))}/changes${withRevisionId ? `?with=${encodeURIComponent(String(withRevisionId))}` : ''}`,
  adminPeople: '/admin/people',
  adminProjects: '/admin/projects',
  adminOutbox: '/admin/outbox',
} as const;

/**
 * Where to go after signing in: only same-app paths are accepted, so a crafted
 * link cannot send someone to another site.
 */
export function safeReturnPath(value: string | null | undefined): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return paths.home;
  if (value.startsWith(paths.signIn)) return paths.home;
  return value;
}
