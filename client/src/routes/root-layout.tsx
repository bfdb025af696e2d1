import { useEffect, useRef } from 'react';
import { Link, Outlet, ScrollRestoration, useLocation, useMatches } from 'react-router';
import { CAUTION_SUMMARY } from '@shared/api';
import { paths } from '../lib/paths';
import { useCurrentUser } from '../features/session';
import { MainNav } from './main-nav';

/**
 * The frame of every page: skip link, header with the main navigation, the page,
 * and the caution footer that is always in view.
 */
export function RootLayout() {
  const { user } = useCurrentUser();
  const location = useLocation();
  const shownPath = useRef(location.pathname);
  // Result pages (wide tables, drawings) ask for more width through their route handle.
  const wide = useMatches().some((m) => (m.handle as { wide?: boolean } | undefined)?.wide);
  const width = wide ? 'max-w-[100rem]' : 'max-w-page';

  // After navigating, put focus on the new page's title so screen readers announce it
  // and keyboard users start at the content (not on the first page load).
  useEffect(() => {
    if (shownPath.current === location.pathname) return;
    shownPath.current = location.pathname;
    const title = document.querySelector<HTMLElement>('[data-page-title]') ?? document.getElementById('main');
    title?.focus({ preventScroll: true });
  }, [location.pathname]);

  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="no-print sr-only focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-50 focus:rounded-control focus:bg-ink focus:px-4 focus:py-2 focus:text-white"
      >
        Skip to content
      </a>

      <header className="border-b border-rule bg-card">
        <div className="h-1 bg-copper" aria-hidden="true" />
        <div className={`mx-auto flex ${width} flex-wrap items-center gap-x-10 gap-y-2 px-gutter py-3`}>
          <Link to={user ? paths.home : paths.signIn} className="flex items-baseline gap-2 text-ink no-underline hover:text-ink hover:no-underline">
            <Wordmark />
            <span className="sr-only">, home</span>
          </Link>
          {user ? <MainNav user={user} /> : null}
        </div>
      </header>

      <main id="main" tabIndex={-1} className={`mx-auto w-full ${width} flex-1 px-gutter py-section`}>
        <Outlet />
      </main>

      <footer className="sticky bottom-0 z-10 border-t border-rule bg-paper/95 backdrop-blur-sm print:static">
        <p className={`mx-auto ${width} px-gutter py-2 text-fine text-muted`}>
          <strong className="font-semibold text-heed">Caution: </strong>
          {CAUTION_SUMMARY}{' '}
          <Link to={paths.about} className="no-print whitespace-nowrap">
            Scope and cautions
          </Link>
        </p>
      </footer>
      <ScrollRestoration />
    </div>
  );
}

/** The name, set in the ledger style: a copper gauge line through a ruled mark. */
function Wordmark() {
  return (
    <>
      <svg aria-hidden="true" viewBox="0 0 20 20" className="size-5 self-center">
        <path d="M2 5h16M2 10h16M2 15h16" stroke="var(--color-rule)" strokeWidth="1.5" />
        <path d="M10 2v16" stroke="var(--color-copper)" strokeWidth="2.5" />
      </svg>
      <span className="text-lead font-bold tracking-tight">Gaugeline</span>
      <span className="hidden text-fine text-muted md:inline">Steel tension checks</span>
    </>
  );
}
