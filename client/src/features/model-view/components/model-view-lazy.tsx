import { lazy, Suspense } from 'react';
import { LoadingState } from '../../../ui';
import type { ModelViewProps } from './model-view';
import { useDisplayGeometry } from '../api/use-display-geometry';
import { useAllMembers } from '../api/use-all-members';

// three.js and the scene code load only when a 3D view is first shown.
const LoadedModelView = lazy(() => import('./model-view').then((m) => ({ default: m.ModelView })));

export function ModelView(props: ModelViewProps) {
  // Start both downloads while the 3D code itself loads; the view reads them from the cache.
  useDisplayGeometry(props.projectId, props.revisionId);
  useAllMembers(props.projectId, props.revisionId);
  return (
    <Suspense
      fallback={
        <div style={{ minHeight: props.height ?? 560 }} className="grid place-items-center rounded-card border border-rule bg-ledger">
          <LoadingState label="Loading the 3D view…" />
        </div>
      }
    >
      <LoadedModelView {...props} />
    </Suspense>
  );
}
