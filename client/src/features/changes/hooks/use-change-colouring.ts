import { useMemo, useRef } from 'react';
import { errorMessage } from '../../../lib/api-client';
import { useUnits } from '../../../lib/units';
import { useComparison } from '../api/use-comparison';
import { changeColouring, type ChangeColouring } from '../components/change-colouring';

/**
 * The changes from an earlier revision as a colouring of this revision's 3D view; loads
 * the comparison only while `enabled` (the view is coloured by change).
 */
export function useChangeColouring(
  projectId: number,
  revisionId: number,
  withRevisionId: number | null,
  enabled: boolean,
  hrefBefore?: (globalId: string) => string,
): { colouring: ChangeColouring | null; error: string | null } {
  const comparison = useComparison(projectId, revisionId, enabled ? withRevisionId : null);
  const units = useUnits();
  // A path builder made afresh on each render must not rebuild the colouring (and repaint the view).
  const href = useRef(hrefBefore);
  href.current = hrefBefore;
  const colouring = useMemo(
    () => (comparison.data ? changeColouring(comparison.data, { force: (n) => units.force(n).text, hrefBefore: href.current && ((g) => href.current!(g)) }) : null),
    [comparison.data, units],
  );
  return { colouring: enabled ? colouring : null, error: enabled && comparison.isError ? `The changes could not be loaded: ${errorMessage(comparison.error)}` : null };
}
