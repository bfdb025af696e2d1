import { usePageTitle } from '../lib/page-title';
import { PageHeader, Panel, UnitsSwitch } from '../ui';
import { UNIT_SYSTEM_LABELS, useUnits } from '../lib/units';
import { AccountSummary, ChangePasswordForm } from '../features/session';
import { useSignedInUser } from './guards';

export function AccountPage() {
  usePageTitle('Account');
  const user = useSignedInUser();
  const units = useUnits();
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
        <Panel title="Units" description="How forces, lengths, areas and stresses read in results. Kept in this browser.">
          <div className="flex flex-col gap-2">
            <UnitsSwitch />
            <p className="text-small text-muted">Now showing {UNIT_SYSTEM_LABELS[units.system]}. Checks are always made in SI; only the display changes.</p>
          </div>
        </Panel>
      </div>
    </>
  );
}
