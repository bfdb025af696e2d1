import { lazy, Suspense } from 'react';
import { LoadingState } from '../../../ui';
import type { ModelViewProps } from './model-view';

// three.js and the scene code load only when a 3D view is first shown.
const LoadedModelView = lazy(() => import('./model-view').then((m) => ({ default: m.ModelView })));

export function ModelView(props: ModelViewProps) {
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
