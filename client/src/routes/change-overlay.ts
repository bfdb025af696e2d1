import { useCallback, useState } from 'react';
import type { Revision } from '@shared/api';
import { paths } from '../lib/paths';
import { useRevisions } from '../features/models';
import { useChangeColouring } from '../features/changes';
import type { OverlayChoice } from '../features/model-view';

/** The latest checked revision of the same model before this one, once the model's revisions are known. */
export function usePreviousRevision(projectId: number, revision: Revision | undefined): Revision | null {
  const revisions = useRevisions(projectId, revision?.modelId ?? 0, revision !== undefined && revision.number > 1);
  if (!revision) return null;
  const earlier = (revisions.data ?? []).filter((x) => x.number < revision.number && x.status === 'done').sort((a, b) => b.number - a.number);
  return earlier[0] ?? null;
}

/**
 * "Colour by change since revision N" for a revision's 3D view: the changes feature makes
 * the colouring, the model view draws it; they meet here. Undefined when there is nothing
 * earlier to compare with. The comparison loads only once the choice is made.
 */
export function useChangeOverlay(projectId: number, revisionId: number, earlier: { id: number; number: number } | null, startActive: boolean): OverlayChoice | undefined {
  const [active, setActive] = useState(startActive);
  const hrefBefore = useCallback((globalId: string) => paths.member(projectId, earlier?.id ?? 0, globalId), [projectId, earlier?.id]);
  const { colouring, error } = useChangeColouring(projectId, revisionId, earlier?.id ?? null, active, hrefBefore);
  if (!earlier) return undefined;
  return { label: `change since revision ${earlier.number}`, active, onActiveChange: setActive, overlay: colouring, error };
}
