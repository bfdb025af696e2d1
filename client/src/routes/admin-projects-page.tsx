import { useSearchParams } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { ErrorState, LoadingState, PageHeader, Panel } from '../ui';
import { ProjectAccess } from '../features/admin';
import { CreateProjectForm, useProjects } from '../features/projects';

/** Project access: the projects list from the projects feature feeds the admin access panel. */
export function AdminProjectsPage() {
  usePageTitle('Project access');
  const projects = useProjects();
  const [params, setParams] = useSearchParams();
  const selected = Number(params.get('project')) || null;
  const select = (projectId: number | null) =>
    setParams(projectId ? { project: String(projectId) } : {}, { replace: true, preventScrollReset: true });

  return (
    <>
      <PageHeader eyebrow="Admin" title="Project access" description="Start projects and decide who can see each one." />
      <div data-layout="split" className="grid gap-block xl:grid-cols-[minmax(0,1fr)_21rem] xl:items-start">
        <Panel title="Who has access">
          {projects.isPending ? (
            <LoadingState label="Loading projects…" />
          ) : projects.isError ? (
            <ErrorState title="Projects could not be loaded" error={projects.error} onRetry={() => void projects.refetch()} />
          ) : projects.data.length === 0 ? (
            <p className="text-muted">There are no projects yet. Start one with the form alongside.</p>
          ) : (
            <ProjectAccess projects={projects.data} selectedProjectId={selected} onSelectProject={select} />
          )}
        </Panel>
        <Panel title="Start a project" className="no-print">
          <CreateProjectForm onCreated={(project) => select(project.id)} />
        </Panel>
      </div>
    </>
  );
}
