import { useEffect, useState } from 'react';
import { Link, useLocation, useNavigate } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { Card, Notice } from '../ui';
import { SetPasswordForm } from '../features/session';

/** The token of an e-mailed link, from `#token=…` (the fragment never reaches the server's logs). */
function tokenFromHash(hash: string): string | null {
  const token = new URLSearchParams(hash.replace(/^#/, '')).get('token');
  return token && /^[A-Za-z0-9_-]{20,200}$/.test(token) ? token : null;
}

/**
 * Public: choose a password from an invitation or reset link. The token is read once and
 * taken out of the address bar, so it does not linger in history or get copied along.
 */
export function SetPasswordPage() {
  usePageTitle('Choose a password');
  const location = useLocation();
  const navigate = useNavigate();
  const [token] = useState(() => tokenFromHash(location.hash));
  useEffect(() => {
    if (location.hash) void navigate({ pathname: location.pathname, search: location.search, hash: '' }, { replace: true });
  }, [location.hash, location.pathname, location.search, navigate]);

  const askAgain = (
    <p>
      <Link to={paths.forgotPassword}>Ask for a new link</Link>
    </p>
  );

  return (
    <div className="mx-auto grid max-w-page gap-section md:grid-cols-[minmax(0,1fr)_minmax(0,26rem)] md:items-start">
      <div className="max-w-prose pt-2">
        <p className="ledger-label mb-2">Gaugeline</p>
        <h1 tabIndex={-1} data-page-title className="text-headline font-bold tracking-tight">
          Choose a password
        </h1>
        <p className="mt-3 text-lead text-muted">For a new account or a forgotten password. The link from your e-mail works once.</p>
      </div>
      <Card className="px-6 py-6">
        {token ? (
          <SetPasswordForm
            token={token}
            done={
              <p>
                <Link to={paths.signIn} className="font-semibold">
                  Password set — sign in
                </Link>{' '}
                with your e-mail address and the new password.
              </p>
            }
            expired={askAgain}
          />
        ) : (
          <Notice tone="error" title="This page needs the link from your e-mail">
            <p>Open the link in the message exactly as it came, or ask for a new one if it has been used.</p>
            <div className="mt-2">{askAgain}</div>
          </Notice>
        )}
      </Card>
    </div>
  );
}
