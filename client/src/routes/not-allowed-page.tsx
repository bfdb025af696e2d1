import { Link } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { ROLE_LABELS } from '../lib/roles';
import { PageHeader } from '../ui';
import { useCurrentUser } from '../features/session';

export function NotAllowedPage() {
  usePageTitle('Not allowed');
  const { user } = useCurrentUser();
  return (
    <div className="max-w-prose">
      <PageHeader title="Not allowed" eyebrow="Access" />
      <p>This page is for admins only.{user && ` You are signed in as ${user.name}, with the ${ROLE_LABELS[user.role]} role.`}</p>
      <p className="mt-3 text-muted">If you need it, ask an admin in your organisation to change your role.</p>
      <p className="mt-block">
        <Link to={paths.home}>Back to projects</Link>
      </p>
    </div>
  );
}
