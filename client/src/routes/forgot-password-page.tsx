import { Link } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { Card } from '../ui';
import { ForgotPasswordForm } from '../features/session';

/** Public: ask for a one-time link to choose a new password. */
export function ForgotPasswordPage() {
  usePageTitle('Forgotten password');
  return (
    <div className="mx-auto grid max-w-page gap-section md:grid-cols-[minmax(0,1fr)_minmax(0,26rem)] md:items-start">
      <div className="max-w-prose pt-2">
        <p className="ledger-label mb-2">Gaugeline</p>
        <h1 tabIndex={-1} data-page-title className="text-headline font-bold tracking-tight">
          Forgotten password
        </h1>
        <p className="mt-3 text-lead text-muted">Give the address you sign in with. If it belongs to an account, we e-mail a link to choose a new password.</p>
        <p className="mt-3 text-small text-muted">
          Your current password keeps working until you choose a new one. <Link to={paths.signIn}>Back to sign in</Link>
        </p>
      </div>
      <Card className="px-6 py-6">
        <ForgotPasswordForm />
      </Card>
    </div>
  );
}
