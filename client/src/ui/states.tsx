import type { ReactNode } from 'react';
import { ApiError, errorMessage } from '../lib/api-client';
import { Button } from './button';

/** Asking again only helps when the failure was not the server's considered answer (not found, not allowed…). */
function worthRetrying(error: unknown): boolean {
  if (!(error instanceof ApiError)) return true;
  return error.status === 0 || error.status === 408 || error.status === 429 || error.status >= 500;
}

/** Something failed to load: say what, in the server's words, and offer to try again where that can help. */
export function ErrorState({ title = 'This could not be loaded', error, onRetry }: { title?: string; error: unknown; onRetry?: () => void }) {
  return (
    <div role="alert" className="rounded-card border border-l-4 border-rule border-l-fault bg-fault-wash px-4 py-4">
      <p className="font-semibold text-fault">{title}</p>
      <p className="mt-1 text-small text-ink">{errorMessage(error)}</p>
      {onRetry && worthRetrying(error) && (
        <Button variant="secondary" size="sm" className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}

/** Nothing here yet: say so plainly, and what would change that. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-card border border-dashed border-edge/60 px-5 py-6">
      <p className="font-semibold text-ink">{title}</p>
      {children && <div className="mt-1 max-w-prose text-small text-muted">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}
