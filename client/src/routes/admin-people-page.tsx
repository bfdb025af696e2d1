import { usePageTitle } from '../lib/page-title';
import { PageHeader, Panel } from '../ui';
import { CreatePersonForm, PeopleTable } from '../features/admin';
import { useSignedInUser } from './guards';

export function AdminPeoplePage() {
  usePageTitle('People');
  const user = useSignedInUser();
  return (
    <>
      <PageHeader eyebrow="Admin" title="People" description="Who can sign in, and what each person may do." />
      <div className="grid gap-block xl:grid-cols-[minmax(0,1fr)_22rem] xl:items-start">
        <Panel title="Everyone">
          <PeopleTable currentUserId={user.id} />
        </Panel>
        <Panel title="Add a person" className="no-print">
          <CreatePersonForm />
        </Panel>
      </div>
    </>
  );
}
