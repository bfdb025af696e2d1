import { usePageTitle } from '../lib/page-title';
import { buttonClass, PageHeader, Panel } from '../ui';
import { CreatePersonForm, PeopleTable } from '../features/admin';
import { useSignedInUser } from './guards';

export function AdminPeoplePage() {
  usePageTitle('People');
  const user = useSignedInUser();
  return (
    <>
      <PageHeader
        eyebrow="Admin"
        title="People"
        description="Who can sign in, and what each person may do."
        actions={
          <a href="#add-person" className={buttonClass('secondary', 'md', 'no-print')}>
            Add a person
          </a>
        }
      />
      <div className="flex flex-col gap-block">
        <Panel title="Everyone">
          <PeopleTable currentUserId={user.id} />
        </Panel>
        <div id="add-person" className="no-print scroll-mt-4">
          <Panel title="Add a person" description="They can sign in once they have a password: one you give them, or one they choose from the e-mailed invitation.">
            <CreatePersonForm />
          </Panel>
        </div>
      </div>
    </>
  );
}
