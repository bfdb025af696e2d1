import type { SessionUser } from '@shared/api';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '../../../lib/roles';
import { Badge } from '../../../ui';

/** Who is signed in, as a definition list. */
export function AccountSummary({ user }: { user: SessionUser }) {
  return (
    <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-2 text-small">
      <dt className="ledger-label pt-0.5">Name</dt>
      <dd>{user.name}</dd>
      <dt className="ledger-label pt-0.5">E-mail</dt>
      <dd className="break-all">{user.email}</dd>
      <dt className="ledger-label pt-0.5">Role</dt>
      <dd>
        <Badge tone={user.role === 'admin' ? 'copper' : 'neutral'}>{ROLE_LABELS[user.role]}</Badge>
        <span className="ml-2 text-muted">{ROLE_DESCRIPTIONS[user.role]}</span>
      </dd>
    </dl>
  );
}
