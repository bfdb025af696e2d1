import type { ReactNode } from 'react';
import { formatDate } from '../../../lib/format';
import { ErrorState, LoadingState, PageHeader } from '../../../ui';
import { useProject } from '../api/use-project';
import { standardName } from './standard-name';

/**
 * One project: its settings, then whatever the page puts below them (models, uploads).
 * The page header is always rendered first so focus can land on it while data loads.
 */
export function ProjectOverview({ projectId, children }: { projectId: number; children?: ReactNode }) {
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

          {children}
        </div>
      )}
    </>
  );
}
