import { Link, Navigate, useNavigate, useSearchParams } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { paths, safeReturnPath } from '../lib/paths';
import { Card, ErrorState, LoadingState } from '../ui';
import { SignInForm, useCurrentUser } from '../features/session';

export function SignInPage() {
  usePageTitle('Sign in');
  const [params] = useSearchParams();
  const next = safeReturnPath(params.get('next'));
  const navigate = useNavigate();
  const { user, isLoading, error, retry } = useCurrentUser();

  if (isLoading) return <LoadingState label="Checking your session…" />;
  if (user) return <Navigate to={next} replace />;

  return (
    <div className="mx-auto grid max-w-page gap-section md:grid-cols-[minmax(0,1fr)_minmax(0,26rem)] md:items-start">
      <div className="max-w-prose pt-2">
        <p className="ledger-label mb-2">Gaugeline</p>
        <h1 tabIndex={-1} data-page-title className="text-headline font-bold tracking-tight">
          Sign in
        </h1>
        <p className="mt-3 text-lead text-muted">
          Tension capacity of steel members and their bolted ends, read from your IFC models and checked to AS 4100, AISC 360 or EN 1993.
        </p>
        <p className="mt-3 text-small text-muted">
          Accounts are set up by an admin in your organisation. <Link to={paths.about}>What Gaugeline checks, and what it does not.</Link>
        </p>
      </div>
      <Card className="px-6 py-6">
        {error ? (
          <ErrorState title="Gaugeline could not reach the server" error={error} onRetry={retry} />
        ) : (
          <>
            <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
            <p className="mt-5 border-t border-rule pt-4 text-small">
              <Link to={paths.forgotPassword}>Forgot your password?</Link>
            </p>
          </>
        )}
      </Card>
    </div>
  );
}
