import { formatDate } from '../../../lib/format';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '../../../ui';
import { useProject } from '../api/use-project';
import { standardName } from './standard-name';

/**
 * One project: its settings, and the places where models and results will appear.
 * The page header is always rendered first so focus can land on it while data loads.
 */
export function ProjectOverview({ projectId }: { projectId: number }) {
  const project = useProject(projectId);
  const data = project.data;

  return (
    <>
      <PageHeader eyebrow="Project" title={data?.name ?? (project.isError ? 'Project unavailable' : 'Project')} description={data?.description || undefined} />
      {project.isPending && <LoadingState label="Loading the project…" />}
      {project.isError && <ErrorState title="This project could not be opened" error={project.error} onRetry={() => void project.refetch()} />}
      {data && (
        <div className="flex flex-col gap-block">
          <dl className="grid grid-cols-2 gap-x-6 gap-y-3 rounded-card border border-rule bg-card px-5 py-4 text-small sm:grid-cols-4" data-print="keep">
            <div>
              <dt className="ledger-label">Design standard</dt>
              <dd className="mt-0.5 font-semibold">{standardName(data.standard)}</dd>
            </div>
            <div>
              <dt className="ledger-label">Default steel grade</dt>
              <dd className="mt-0.5 font-semibold">{data.defaultGrade || 'None set'}</dd>
            </div>
            <div>
              <dt className="ledger-label">Created</dt>
              <dd className="mt-0.5">
                <time dateTime={data.createdAt}>{formatDate(data.createdAt)}</time>
              </dd>
            </div>
            <div>
              <dt className="ledger-label">Last changed</dt>
              <dd className="mt-0.5">
                <time dateTime={data.updatedAt}>{formatDate(data.updatedAt)}</time>
              </dd>
            </div>
          </dl>

          <div className="grid gap-block lg:grid-cols-2">
            <Panel title="Models" description="IFC building models uploaded to this project.">
              <EmptyState title="Nothing has been uploaded yet">
                No IFC model has been uploaded to this project. Once one is, Gaugeline lists the steel tension members it finds and
                their bolted ends here.
              </EmptyState>
            </Panel>
            <Panel title="Results" description={`Tension checks to ${standardName(data.standard)}.`}>
              <EmptyState title="No results yet">
                There is nothing to check until a model has been uploaded. Results will show each member&rsquo;s utilisation, with every
                assumed value listed for review.
              </EmptyState>
            </Panel>
          </div>
        </div>
      )}
    </>
  );
}
