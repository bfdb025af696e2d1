import { useState } from 'react';
import { Link } from 'react-router';
import type { IfcModel, Revision } from '@shared/api';
import { formatCount, formatDateTime } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { Button, buttonClass, EmptyState, ErrorState, LoadingState, Table, TBody, Td, Th, THead, Tr, RowHeader } from '../../../ui';
import { useModels } from '../api/use-models';
import { useRevisions } from '../api/use-revisions';
import { useRevision } from '../api/use-revision';
import { ForcesForm } from './forces-form';
import { JobReport, JobStatusBadge } from './job-status';

/**
 * The project's models, each with its latest revision's state, its revision history
 * on demand, and (for engineers) a forces file for the latest checked revision.
 */
export function ModelsList({ projectId, canEdit, emptyHint }: { projectId: number; canEdit: boolean; emptyHint: string }) {
  const models = useModels(projectId);
  if (models.isPending) return <LoadingState label="Loading models…" />;
  if (models.isError) return <ErrorState title="The models could not be loaded" error={models.error} onRetry={() => void models.refetch()} />;
  if (models.data.length === 0) return <EmptyState title="Nothing has been uploaded yet">{emptyHint}</EmptyState>;
  return (
    <ul className="flex flex-col divide-y divide-rule" aria-label="Models">
      {models.data.map((model) => (
        <li key={model.id} className="py-4 first:pt-0 last:pb-0">
          <ModelEntry projectId={projectId} model={model} canEdit={canEdit} />
        </li>
      ))}
    </ul>
  );
}

function ModelEntry({ projectId, model, canEdit }: { projectId: number; model: IfcModel; canEdit: boolean }) {
  const [showHistory, setShowHistory] = useState(false);
  const [showForces, setShowForces] = useState(false);
  const latest = model.latestRevision;
  return (
    <article aria-label={model.name} className="flex flex-col gap-3">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-lead font-semibold">{model.name}</h3>
        <p className="text-small text-muted">
          {formatCount(model.revisionCount)} {model.revisionCount === 1 ? 'revision' : 'revisions'}
        </p>
      </header>
      {latest ? (
        <div className="flex flex-col gap-2">
          <p className="text-small text-muted">
            Latest: revision {latest.number}, {latest.fileName}, uploaded {formatDateTime(latest.createdAt)}
            {latest.uploadedBy ? ` by ${latest.uploadedBy}` : ''}
          </p>
          <LatestRevision projectId={projectId} revision={latest} />
        </div>
      ) : (
        <p className="text-small text-muted">No revision yet.</p>
      )}
      <div className="no-print flex flex-wrap gap-2">
        <Button variant="quiet" size="sm" aria-expanded={showHistory} onClick={() => setShowHistory((v) => !v)}>
          {showHistory ? 'Hide revision history' : 'Revision history'}
        </Button>
        {model.revisionCount >= 2 && latest?.status === 'done' && (
          <Link to={paths.revisionChanges(projectId, latest.id)} className={buttonClass('quiet', 'sm')}>
            Compare with previous<span className="sr-only"> revision: what changed in revision {latest.number} of {model.name}</span>
          </Link>
        )}
        {canEdit && latest?.status === 'done' && (
          <Button variant="quiet" size="sm" aria-expanded={showForces} onClick={() => setShowForces((v) => !v)}>
            {showForces ? 'Close forces file' : 'Apply a forces file'}
          </Button>
        )}
      </div>
      {showForces && latest?.status === 'done' && (
        <div className="rounded-card border border-rule bg-paper px-4 py-3">
          <ForcesForm projectId={projectId} revisionId={latest.id} revisionNumber={latest.number} />
        </div>
      )}
      {showHistory && <RevisionHistory projectId={projectId} model={model} />}
    </article>
  );
}

/** While the latest revision works, follow it every second; once finished, show the outcome. */
function LatestRevision({ projectId, revision }: { projectId: number; revision: Revision }) {
  const live = useRevision(projectId, revision.id);
  return <JobReport projectId={projectId} revision={live.data ?? revision} />;
}

function RevisionHistory({ projectId, model }: { projectId: number; model: IfcModel }) {
  const revisions = useRevisions(projectId, model.id);
  if (revisions.isPending) return <LoadingState label="Loading revisions…" />;
  if (revisions.isError) return <ErrorState title="The revisions could not be loaded" error={revisions.error} onRetry={() => void revisions.refetch()} />;
  return (
    <Table caption={`Revisions of ${model.name}`} framed>
      <THead>
        <tr>
          <Th numeric>Rev.</Th>
          <Th>File</Th>
          <Th>Uploaded</Th>
          <Th>State</Th>
          <Th numeric>Checked</Th>
          <Th>
            <span className="sr-only">Changes</span>
          </Th>
        </tr>
      </THead>
      <TBody>
        {revisions.data.map((r) => (
          <Tr key={r.id}>
            <RowHeader className="text-right">
              {r.status === 'done' ? <Link to={paths.revision(projectId, r.id)}>{r.number}</Link> : r.number}
            </RowHeader>
            <Td className="max-w-48 truncate" title={r.fileName}>
              {r.fileName}
            </Td>
            <Td>
              <time dateTime={r.createdAt}>{formatDateTime(r.createdAt)}</time>
              {r.uploadedBy && <span className="block text-fine text-muted">{r.uploadedBy}</span>}
            </Td>
            <Td>
              <JobStatusBadge revision={r} />
              {r.status === 'failed' && r.failure && <span className="mt-1 block text-fine text-fault">{r.failure.message}</span>}
            </Td>
            <Td numeric>{r.summary ? formatCount(r.summary.checked) : '—'}</Td>
            <Td className="text-right whitespace-nowrap">
              {r.status === 'done' && revisions.data.some((x) => x.number < r.number && x.status === 'done') && (
                <Link to={paths.revisionChanges(projectId, r.id)}>
                  Changes<span className="sr-only"> in revision {r.number} since the previous one</span>
                </Link>
              )}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
