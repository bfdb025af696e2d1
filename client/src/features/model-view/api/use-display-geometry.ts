import { useQuery } from '@tanstack/react-query';
import { parseDisplayGeometry, type DisplayGeometry } from '@shared/geometry/display-geometry-format';
import { ApiError, NETWORK_ERROR } from '../../../lib/api-client';

export const geometryKey = (projectId: number, revisionId: number) => ['geometry', projectId, revisionId] as const;

/** GET …/revisions/:id/geometry: the display geometry file (binary), parsed. Never changes for a revision. */
export async function fetchDisplayGeometry(projectId: number, revisionId: number, signal?: AbortSignal): Promise<DisplayGeometry> {
  let response: Response;
  try {
    response = await fetch(`/api/projects/${projectId}/revisions/${revisionId}/geometry`, { credentials: 'same-origin', signal });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, { error: NETWORK_ERROR, message: 'Could not reach the server. Check your connection and try again.' });
  }
  if (!response.ok) {
    let body: { error?: string; message?: string } = {};
    try {
      body = await response.json();
    } catch {
      // not JSON
    }
    throw new ApiError(response.status, { error: body.error ?? `http.${response.status}`, message: body.message ?? `The server answered ${response.status}.` });
  }
  return parseDisplayGeometry(await response.arrayBuffer());
}

export function useDisplayGeometry(projectId: number, revisionId: number) {
  return useQuery({
    queryKey: geometryKey(projectId, revisionId),
    queryFn: ({ signal }) => fetchDisplayGeometry(projectId, revisionId, signal),
    staleTime: Infinity,
    gcTime: 5 * 60_000,
    // The geometry is built just after the results: while it is, ask again every two seconds.
    retry: (count, error) => error instanceof ApiError && error.code === 'geometry.pending' && count < 300,
    retryDelay: 2000,
  });
}
