import { Link } from 'react-router';
import { RESULT_BANDS } from '@shared/api';
import { formatCount } from '../../../lib/format';
import { useUnits } from '../../../lib/units';
import { BandLegend, BandTag, ErrorState, Figure, LoadingState, UtilisationFigure } from '../../../ui';
import { useOverview } from '../api/use-overview';
import { UtilisationChart } from './utilisation-chart';

/** The revision at a glance: how many members fall in each band, the spread of utilisation, the most critical members. */
export function RevisionOverviewPanel({ projectId, revisionId, memberHref }: { projectId: number; revisionId: number; memberHref: (globalId: string) => string }) {
  const overview = useOverview(projectId, revisionId);
  const units = useUnits();
  if (overview.isPending) return <LoadingState label="Loading the overview…" />;
  if (overview.isError) return <ErrorState title="The overview could not be loaded" error={overview.error} onRetry={() => void overview.refetch()} />;
  const o = overview.data;
  return (
    <div className="flex flex-col gap-block">
      <div className="flex flex-col gap-3">
        <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-6" aria-label="Members per band">
          <div className="rounded-card border border-rule px-3 py-2">
            <dt className="ledger-label">Tension members</dt>
            <dd className="figures text-title font-bold">{formatCount(o.total)}</dd>
          </div>
          {RESULT_BANDS.map((band) => (
            <div key={band} className="rounded-card border border-rule px-3 py-2" data-band-count={band}>
              <dt className="text-small">
                <BandTag band={band} />
              </dt>
              <dd className="figures text-title font-bold">{formatCount(o.bands[band] ?? 0)}</dd>
            </div>
          ))}
        </dl>
        <BandLegend />
      </div>
      <div className="grid gap-block xl:grid-cols-[minmax(0,1.3fr)_minmax(0,1fr)]">
        <UtilisationChart histogram={o.histogram} unknown={o.bands.unknown ?? 0} />
        <div>
          <h3 className="ledger-label mb-2">Most critical</h3>
          {o.critical.length === 0 ? (
            <p className="text-small text-muted">No member has a result yet: give design forces to see utilisation.</p>
          ) : (
            <ol className="divide-y divide-rule rounded-card border border-rule text-small" aria-label="Most critical members">
              {o.critical.map((m) => (
                <li key={m.globalId} className="flex items-baseline gap-3 px-3 py-1.5">
                  <span className="w-24 shrink-0 text-right">
                    <UtilisationFigure utilisation={m.utilisation} band={m.band} />
                  </span>
                  <span className="min-w-0 flex-1 truncate">
                    <Link to={memberHref(m.globalId)} className="font-semibold">
                      {m.tag ?? m.globalId}
                    </Link>
                    <span className="text-muted"> · {m.profile ?? m.ifcClass}</span>
                  </span>
                  <span className="hidden text-muted sm:inline">{m.governing}</span>
                  <Figure className="hidden md:inline" measure={m.designForceN == null ? null : units.force(m.designForceN)} />
                </li>
              ))}
            </ol>
          )}
        </div>
      </div>
    </div>
  );
}
