import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { BAND_STYLE, type MemberRow } from '@shared/api';
import type { DisplayGeometryEntry } from '@shared/geometry/display-geometry-format';
import { lookOf, missingReason } from '../scene/member-look';

export const memberSheetPath = (projectId: number, revisionId: number, globalId: string) =>
  `/projects/${encodeURIComponent(String(projectId))}/revisions/${encodeURIComponent(String(revisionId))}/members/${encodeURIComponent(globalId)}`;

const kN = (n: number | null) => (n == null ? '—' : (n / 1000).toLocaleString('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 }));

export function UtilisationText({ entry, row }: { entry: DisplayGeometryEntry; row: MemberRow | undefined }) {
  const look = lookOf(entry, row);
  const reason = missingReason(entry, row);
  if (look.kind !== 'band' || look.band === 'unknown' || !row || row.utilisation == null) return <span className="text-muted">{reason ?? 'no result'}</span>;
  const band = look.band;
  return (
    <span className={band === 'over' || band === 'tight' ? 'font-bold' : undefined}>
      {row.utilisation.toFixed(2)} <span className="font-normal text-muted">· {BAND_STYLE[band].label}</span>
    </span>
  );
}

/** The picked element's key figures, with the way to its member sheet. */
export function MemberCard({ projectId, revisionId, entry, row }: { projectId: number; revisionId: number; entry: DisplayGeometryEntry; row: MemberRow | undefined }) {
  const figures: [string, ReactNode][] = [
    ['Class', entry.ifcClass],
    ['Profile', row?.profile ?? '—'],
    ['Grade', row?.grade ?? '—'],
    ['Storey', row?.storey ?? '—'],
    ['Utilisation', <UtilisationText key="u" entry={entry} row={row} />],
    ['Design force', row ? `${kN(row.designForceN)} kN` : '—'],
    ['Capacity', row ? `${kN(row.designCapacityN)} kN` : '—'],
    ['Governing', row?.governing ?? '—'],
  ];
  return (
    <section aria-label="Picked member" className="rounded-card border border-rule bg-card p-3" data-testid="model-view-card">
      <p className="ledger-label">Picked member</p>
      <p className="font-semibold text-ink">{row?.tag ?? row?.name ?? entry.ifcClass}</p>
      <p className="font-mono text-fine break-all text-muted" data-global-id={entry.globalId}>
        {entry.globalId}
      </p>
      <dl className="figures mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-small">
        {figures.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-muted">{k}</dt>
            <dd className="min-w-0 truncate">{v}</dd>
          </div>
        ))}
      </dl>
      {row && (
        <Link className="mt-2 inline-block text-small font-semibold" to={memberSheetPath(projectId, revisionId, entry.globalId)}>
          Open member sheet →
        </Link>
      )}
    </section>
  );
}
