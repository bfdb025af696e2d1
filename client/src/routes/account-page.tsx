import { usePageTitle } from '../lib/page-title';
import { PageHeader, Panel } from '../ui';
import { AccountSummary, ChangePasswordForm } from '../features/session';
import { useSignedInUser } from './guards';

export function AccountPage() {
  usePageTitle('Account');
  const user = useSignedInUser();
  return (
    <>
      <PageHeader title="Account" description="Your details and password." />
      <div className="grid gap-block lg:grid-cols-2 lg:items-start">
        <Panel title="Your details" description="Ask an admin to change your name, e-mail address or role.">
          <AccountSummary user={user} />
        </Panel>
        <Panel title="Change password" className="max-w-form">
          <ChangePasswordForm />
        </Panel>
      </div>
    </>
  );
}
