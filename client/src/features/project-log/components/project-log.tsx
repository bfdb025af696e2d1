import { useState } from 'react';
import { PROJECT_LOG_KINDS, PROJECT_LOG_KIND_LABELS, type ProjectLogKind } from '@shared/api';
import { formatCount } from '../../../lib/format';
import { Button, EmptyState, ErrorState, LoadingState, Select } from '../../../ui';
import { useProjectLog } from '../api/use-project-log';
import { ProjectLogTable } from './project-log-table';

const PAGE_SIZE = 20;
const ALL = '';
const kindOptions = [{ value: ALL, label: 'Every kind' }, ...PROJECT_LOG_KINDS.map((k) => ({ value: k, label: PROJECT_LOG_KIND_LABELS[k] }))];

/**
 * The project log: who uploaded, changed, exported or mailed what, and when, newest first,
 * one kind at a time if asked. The page shows it to engineers and admins only.
 */
export function ProjectLog({ projectId }: { projectId: number }) {
  const [kind, setKind] = useState<ProjectLogKind | typeof ALL>(ALL);
  const [page, setPage] = useState(1);
  const log = useProjectLog(projectId, { page, pageSize: PAGE_SIZE, kind: kind || undefined });
  const data = log.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const kindWords = kind ? PROJECT_LOG_KIND_LABELS[kind].toLowerCase() : 'entries';

  return (
    <div className="flex flex-col gap-4">
      <Select
        label="Show"
        options={kindOptions}
        value={kind}
        onChange={(e) => {
          setKind(e.target.value as ProjectLogKind | typeof ALL);
          setPage(1);
        }}
        className="w-72 max-w-full"
      />
      {log.isPending ? (
        <LoadingState label="Loading the project log…" />
      ) : log.isError && !data ? (
        <ErrorState title="The project log could not be loaded" error={log.error} onRetry={() => void log.refetch()} />
      ) : !data || data.total === 0 ? (
        <EmptyState title="Nothing logged yet">
          {kind ? 'No entry of this kind. Choose “Every kind” to see them all.' : 'Uploads, member changes, exports and mails sent appear here with who did them and when.'}
        </EmptyState>
      ) : (
        <>
          <ProjectLogTable entries={data.entries} caption={`Project log: ${formatCount(data.total)} ${kindWords}, newest first, page ${data.page} of ${pages}`} />
          {pages > 1 && (
            <nav aria-label="Pages of the project log" className="no-print flex flex-wrap items-center gap-3">
              <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => setPage(page - 1)}>
                Newer entries
              </Button>
              <span className="text-small">
                Page <span className="figures font-semibold">{page}</span> of <span className="figures">{pages}</span>
              </span>
              <Button variant="secondary" size="sm" disabled={page >= pages} onClick={() => setPage(page + 1)}>
                Older entries
              </Button>
            </nav>
          )}
        </>
      )}
    </div>
  );
}
