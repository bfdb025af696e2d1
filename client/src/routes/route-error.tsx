import { isRouteErrorResponse, useRouteError } from 'react-router';

/** Last resort when a page fails to render: plain, self-contained, with a way back. */
export function RouteError() {
  const error = useRouteError();
  const detail = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <main id="main" className="mx-auto max-w-prose px-gutter py-section">
      <h1 className="text-headline font-bold">Something went wrong</h1>
      <p className="mt-3">This page could not be shown. Reloading usually helps; if it keeps happening, tell whoever runs Gaugeline for you.</p>
      <p className="mt-3 font-mono text-small text-muted">{detail}</p>
      <p className="mt-block flex gap-4">
        <a href="/">Go to projects</a>
        <button type="button" className="text-copper underline underline-offset-4" onClick={() => window.location.reload()}>
          Reload
        </button>
      </p>
    </main>
  );
}
