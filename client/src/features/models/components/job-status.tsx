import { Link } from 'react-router';
import { JOB_STATUS_LABELS, isJobFinished, type Revision } from '@shared/api';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { Badge, Notice, Spinner } from '../../../ui';

/** The job's state as a stamped word, with a turning dial while it works. */
export function JobStatusBadge({ revision }: { revision: Revision }) {
  const label = JOB_STATUS_LABELS[revision.status];
  if (revision.status === 'done') return <Badge tone="sound">{label}</Badge>;
  if (revision.status === 'failed') return <Badge tone="fault">{label}</Badge>;
  return (
    <span className="inline-flex items-center gap-1.5 text-small text-muted">
      <Spinner size="sm" decorative />
      {label}
    </span>
  );
}

/** A ruled bar for the job's progress (0..1), announced as a progressbar. */
export function ProgressBar({ value, label, valueText }: { value: number; label: string; valueText?: string }) {
  const pct = Math.round(Math.max(0, Math.min(1, value)) * 100);
  return (
    <div
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={pct}
      aria-valuetext={valueText ?? `${pct} %`}
      className="h-2.5 w-full overflow-hidden rounded-control border border-edge bg-ledger"
    >
      <div className="h-full bg-copper transition-[width] duration-300" style={{ width: `${pct}%` }} />
    </div>
  );
}

/**
 * Where one revision's import stands: the step in our words and a bar while it works;
 * the server's message if it failed; what was found and a way to the results once done.
 */
export function JobReport({ projectId, revision }: { projectId: number; revision: Revision }) {
  const label = JOB_STATUS_LABELS[revision.status];
  if (revision.status === 'failed') {
    return (
      <Notice tone="error" title={`Revision ${revision.number}: ${label.toLowerCase()}`}>
        {revision.failure?.message ?? 'The server gave no reason.'}
      </Notice>
    );
  }
  if (!isJobFinished(revision.status)) {
    const pct = Math.round(revision.progress * 100);
    return (
      <div className="flex flex-col gap-2" aria-live="polite">
        <p className="flex items-center justify-between gap-3 text-small">
          <span className="flex items-center gap-2 font-semibold">
            <Spinner size="sm" decorative />
            <span data-job-status={revision.status}>{label}</span>
          </span>
          <span className="figures text-muted">{pct} %</span>
        </p>
        <ProgressBar value={revision.progress} label={`Checking revision ${revision.number}`} valueText={`${label}, ${pct} %`} />
      </div>
    );
  }
  const s = revision.summary;
  return (
    <div className="flex flex-col gap-2" aria-live="polite">
      <p className="flex flex-wrap items-center gap-2 text-small">
        <Badge tone="sound">
          <span data-job-status={revision.status}>{label}</span>
        </Badge>
        {s && (
          <span>
            {formatCount(s.tensionMembers)} tension members found, {formatCount(s.checked)} checked
            {s.withoutForce > 0 && <>, {formatCount(s.withoutForce)} without a design force</>}; {formatCount(s.holes)} holes in{' '}
            {formatCount(s.boltGroups)} bolt groups.
          </span>
        )}
      </p>
      {s && s.warnings.length > 0 && (
        <Notice tone="caution" title={`${s.warnings.length} reading ${s.warnings.length === 1 ? 'note' : 'notes'} from the import`}>
          <ul className="list-disc pl-5">
            {s.warnings.map((w) => (
              <li key={w.code}>
                {w.message} <span className="text-muted">({formatCount(w.count)}×)</span>
              </li>
            ))}
          </ul>
        </Notice>
      )}
      <p>
        <Link to={paths.revision(projectId, revision.id)} className="font-semibold">
          Open the results of revision {revision.number}
        </Link>
      </p>
    </div>
  );
}
