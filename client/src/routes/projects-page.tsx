import { useNavigate } from 'react-router';
import { EDITING_ROLES } from '@shared/api';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { PageHeader, Panel } from '../ui';
import { CreateProjectForm, ProjectList } from '../features/projects';
import { ForRoles, useSignedInUser } from './guards';

export function ProjectsPage() {
  usePageTitle('Projects');
  const user = useSignedInUser();
  const navigate = useNavigate();
  const canCreate = EDITING_ROLES.includes(user.role);

  return (
    <>
      <PageHeader title="Projects" description={canCreate ? 'Open a project, or start a new one.' : 'The projects you have been given access to.'} />
      <div data-layout="split" className={canCreate ? 'grid gap-block lg:grid-cols-[minmax(0,1fr)_21rem] lg:items-start' : undefined}>
        <ProjectList
          emptyHint={
            canCreate
              ? 'Start one with the form alongside. You can invite others to it once it exists.'
              : 'Projects appear here once an admin gives you access to them.'
          }
        />
        <ForRoles roles={EDITING_ROLES}>
          <Panel title="Start a project" level={2} className="no-print">
            <CreateProjectForm onCreated={(project) => navigate(paths.project(project.id))} />
          </Panel>
        </ForRoles>
      </div>
    </>
  );
}
