import { useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router';
import type { ChangeKind } from '@shared/compare/compare-revisions';
import { formatCount } from '../../../lib/format';
import { useUnits } from '../../../lib/units';
import { cx } from '../../../lib/cx';
import { BandTag, buttonClass, EmptyState, ErrorState, Figure, LoadingState, Notice, RowHeader, Table, TBody, Td, Th, THead, Tr, UtilisationFigure } from '../../../ui';
import { comparisonCsvHref, useComparison, type ComparisonChange } from '../api/use-comparison';
import { CHANGE_WORDS, KIND_ORDER } from './change-words';

export interface ChangesViewProps {
  projectId: number;
  /** The later revision (this page's). */
  revisionId: number;
  /** The earlier revision to compare with; null while it is being chosen. */
  withRevisionId: number | null;
  /** A member's sheet in a given revision. */
  memberHref: (revisionId: number, globalId: string) => string;
}

const ALL = 'all';

/**
 * What changed between two revisions of a model, member by member: counts by kind of
 * change (each one filters the table), then one row per changed member with its section,
 * design force and utilisation before and after.
 */
export function ChangesView({ projectId, revisionId, withRevisionId, memberHref }: ChangesViewProps) {
  const comparison = useComparison(projectId, revisionId, withRevisionId);
  const [kind, setKind] = useState<ChangeKind | typeof ALL>(ALL);
  const rows = useMemo(() => {
    const changes = comparison.data?.changes ?? [];
    const shown = kind === ALL ? changes : changes.filter((c) => c.kinds.includes(kind));
    const critical = (c: ComparisonChange) => (c.kinds.includes('newly-critical') ? 1 : 0);
    const worst = (c: ComparisonChange) => Math.max(c.after?.utilisation ?? -1, c.before?.utilisation ?? -1);
    return [...shown].sort((a, b) => critical(b) - critical(a) || worst(b) - worst(a) || a.globalId.localeCompare(b.globalId));
  }, [comparison.data, kind]);

  if (withRevisionId === null) return null;
  if (comparison.isPending) return <LoadingState label="Comparing the revisions…" />;
  if (comparison.isError) return <ErrorState title="The revisions could not be compared" error={comparison.error} onRetry={() => void comparison.refetch()} />;
  const c = comparison.data;
  const before = c.before.number;
  const after = c.after.number;

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <p className="max-w-prose text-small text-muted">
          {formatCount(c.matchedByGlobalId)} {c.matchedByGlobalId === 1 ? 'member' : 'members'} found in both revisions by GlobalId
          {c.matchedByTag > 0 && `, ${formatCount(c.matchedByTag)} more by tag`}; {formatCount(c.changes.length)} changed.
        </p>
        <a href={comparisonCsvHref(projectId, revisionId, c.before.id)} download className={buttonClass('secondary', 'sm', 'no-print')}>
          Download the changes (CSV)
        </a>
      </div>

      {c.warnings.length > 0 && (
        <Notice tone="caution" title="Some members were matched by tag">
          <ul className="list-disc pl-5">
            {c.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
          <p className="mt-1">Those rows show the earlier GlobalId under the current one. Check that each pair really is the same member.</p>
        </Notice>
      )}

      <fieldset className="min-w-0">
        <legend className="ledger-label mb-2">Changes by kind · choose one to list only those members</legend>
        <ul className="grid grid-cols-[repeat(auto-fill,minmax(11rem,1fr))] gap-2">
          <li>
            <KindButton pressed={kind === ALL} onClick={() => setKind(ALL)} count={c.changes.length} heading="Every change" hint="All changed members" />
          </li>
          {KIND_ORDER.map((k) => (
            <li key={k}>
              <KindButton
                pressed={kind === k}
                onClick={() => setKind(kind === k ? ALL : k)}
                count={c.counts[k] ?? 0}
                heading={CHANGE_WORDS[k].heading}
                hint={CHANGE_WORDS[k].hint}
                emphasis={k === 'newly-critical'}
              />
            </li>
          ))}
        </ul>
      </fieldset>

      {c.changes.length === 0 ? (
        <EmptyState title="Nothing changed">
          Every member of revision {after} has the same section, grade, holes, design force and utilisation as in revision {before}.
        </EmptyState>
      ) : rows.length === 0 ? (
        <EmptyState title="No member changed this way">Choose “Every change” to list them all.</EmptyState>
      ) : (
        <ChangesTable rows={rows} before={c.before} after={c.after} memberHref={memberHref} caption={`Changed members, revision ${before} to ${after} (${rows.length} of ${c.changes.length})`} />
      )}
    </div>
  );
}

function KindButton({ pressed, onClick, count, heading, hint, emphasis }: { pressed: boolean; onClick: () => void; count: number; heading: string; hint: string; emphasis?: boolean }) {
  return (
    <button
      type="button"
      aria-pressed={pressed}
      onClick={onClick}
      title={hint}
      className={cx(
        'flex h-full w-full flex-col items-start rounded-card border px-3 py-2 text-left transition-colors',
        pressed ? 'border-copper bg-copper-wash' : 'border-rule bg-card hover:bg-ledger',
        count === 0 && !pressed && 'text-muted',
      )}
    >
      <span className={cx('figures text-title font-bold', emphasis && count > 0 && 'text-band-tight')}>{formatCount(count)}</span>
      <span className="text-small font-semibold">{heading}</span>
    </button>
  );
}

/** "before → after", or the one value when it did not change. */
function BeforeAfter({ before, after, same }: { before: ReactNode; after: ReactNode; same: boolean }) {
  if (same) return <>{after}</>;
  return (
    <span className="inline-flex flex-wrap items-baseline gap-x-1.5">
      <span className="text-muted">{before}</span>
      <span aria-hidden="true" className="text-muted">
        →
      </span>
      <span className="sr-only">became</span>
      <span className="font-semibold">{after}</span>
    </span>
  );
}

const dash = <span className="text-muted">—</span>;

function ChangesTable({
  rows,
  before,
  after,
  memberHref,
  caption,
}: {
  rows: ComparisonChange[];
  before: { id: number; number: number };
  after: { id: number; number: number };
  memberHref: ChangesViewProps['memberHref'];
  caption: string;
}) {
  const units = useUnits();
  return (
    <Table caption={caption} framed>
      <THead>
        <Tr>
          <Th>GlobalId</Th>
          <Th>Tag</Th>
          <Th>Name</Th>
          <Th>What changed</Th>
          <Th>Section and grade</Th>
          <Th numeric>Design force</Th>
          <Th numeric>Utilisation</Th>
          <Th>Band</Th>
        </Tr>
      </THead>
      <TBody>
        {rows.map((c) => {
          const b = c.before;
          const a = c.after;
          const force = (m: typeof a) => (m?.designForceN == null ? dash : <Figure measure={units.force(m.designForceN)} />);
          const util = (m: typeof a) => (m ? <UtilisationFigure utilisation={m.utilisation} band={m.band} /> : dash);
          const band = (m: typeof a) => (m ? <BandTag band={m.band} /> : dash);
          const profile = (m: typeof a) => (m ? (m.profile ?? <span className="text-muted">no profile</span>) : dash);
          const grade = (m: typeof a) => (m ? (m.grade ?? 'no grade') : dash);
          const only = !a || !b;
          return (
            <Tr key={c.globalId} className={c.kinds.includes('removed') ? 'text-muted' : undefined}>
              <RowHeader className="font-mono text-fine font-normal whitespace-nowrap">
                <span data-global-id={c.globalId}>
                  {a ? <Link to={memberHref(after.id, c.globalId)}>{c.globalId}</Link> : <Link to={memberHref(before.id, c.globalId)}>{c.globalId}</Link>}
                </span>
                {c.previousGlobalId && (
                  <span className="block text-muted">
                    was <Link to={memberHref(before.id, c.previousGlobalId)}>{c.previousGlobalId}</Link>
                  </span>
                )}
                {!a && <span className="block font-sans text-muted">sheet of revision {before.number}</span>}
              </RowHeader>
              <Td>{c.tag ?? dash}</Td>
              <Td className="max-w-48 break-words">{c.name ?? dash}</Td>
              <Td>
                <ul className="flex flex-col gap-0.5">
                  {KIND_ORDER.filter((k) => c.kinds.includes(k)).map((k) => (
                    <li key={k} className={cx('whitespace-nowrap', k === 'newly-critical' && 'font-semibold text-band-tight')}>
                      {CHANGE_WORDS[k].word}
                    </li>
                  ))}
                </ul>
              </Td>
              <Td>
                <BeforeAfter before={profile(b)} after={profile(a)} same={!only && b.profile === a.profile} />
                <span className="block text-fine text-muted">
                  <BeforeAfter before={grade(b)} after={grade(a)} same={!only && b.grade === a.grade} />
                </span>
              </Td>
              <Td numeric>
                <BeforeAfter before={force(b)} after={force(a)} same={!only && !c.kinds.includes('force-changed')} />
              </Td>
              <Td numeric>
                <BeforeAfter before={util(b)} after={util(a)} same={!only && b.utilisation === a.utilisation} />
              </Td>
              <Td>
                <BeforeAfter before={band(b)} after={band(a)} same={!only && b.band === a.band} />
              </Td>
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}
