import { useRef, type MouseEvent, type ReactNode } from 'react';
import { Link } from 'react-router';
import type { MemberRow, MemberSortKey } from '@shared/api';
import { cx } from '../../../lib/cx';
import { useUnits } from '../../../lib/units';
import { BandTag, Figure, UtilisationFigure } from '../../../ui';

/**
 * The member ledger: one row per member, keyed by its IFC GlobalId.
 *
 * Selection is owned by whoever renders the table (the revision route), so another
 * view of the same revision (a 3D model view) can share it: pass the selected
 * GlobalIds and take the new set from `onSelectionChange`. Click a box to toggle one
 * member; Shift+click to set a run of rows to the same state.
 */
export interface MemberTableProps {
  rows: readonly MemberRow[];
  sort: MemberSortKey;
  dir: 'asc' | 'desc';
  onSort: (sort: MemberSortKey, dir: 'asc' | 'desc') => void;
  selection: ReadonlySet<string>;
  onSelectionChange: (next: ReadonlySet<string>) => void;
  /** Where a member's sheet is. */
  memberHref: (globalId: string) => string;
  caption: string;
  /** Dim the rows while the next page loads. */
  stale?: boolean;
}

interface Column {
  key: string;
  label: string;
  sort?: MemberSortKey;
  numeric?: boolean;
  /** First sort direction when the header is pressed. */
  firstDir?: 'asc' | 'desc';
}

const COLUMNS: Column[] = [
  { key: 'globalId', label: 'GlobalId', sort: 'globalId' },
  { key: 'tag', label: 'Tag', sort: 'tag' },
  { key: 'name', label: 'Name', sort: 'name' },
  { key: 'ifcClass', label: 'Class', sort: 'ifcClass' },
  { key: 'profile', label: 'Profile', sort: 'profile' },
  { key: 'grade', label: 'Grade', sort: 'grade' },
  { key: 'force', label: 'Design force', sort: 'designForceN', numeric: true, firstDir: 'desc' },
  { key: 'capacity', label: 'Design capacity', sort: 'designCapacityN', numeric: true, firstDir: 'desc' },
  { key: 'utilisation', label: 'Utilisation', sort: 'utilisation', numeric: true, firstDir: 'desc' },
  { key: 'governing', label: 'Governed by', sort: 'governing' },
  { key: 'band', label: 'Band' },
  { key: 'warnings', label: 'Notes', sort: 'warningCount', numeric: true, firstDir: 'desc' },
];

export function MemberTable({ rows, sort, dir, onSort, selection, onSelectionChange, memberHref, caption, stale }: MemberTableProps) {
  const units = useUnits();
  const anchor = useRef<number | null>(null);

  const onPage = rows.map((r) => r.globalId);
  const selectedOnPage = onPage.filter((id) => selection.has(id)).length;
  const allOnPage = rows.length > 0 && selectedOnPage === rows.length;

  const toggleRow = (index: number, event: MouseEvent<HTMLInputElement>) => {
    const id = onPage[index];
    const turnOn = !selection.has(id);
    const next = new Set(selection);
    if (event.shiftKey && anchor.current !== null && anchor.current < onPage.length) {
      const [a, b] = [Math.min(anchor.current, index), Math.max(anchor.current, index)];
      for (let i = a; i <= b; i++) {
        if (turnOn) next.add(onPage[i]);
        else next.delete(onPage[i]);
      }
    } else if (turnOn) next.add(id);
    else next.delete(id);
    anchor.current = index;
    onSelectionChange(next);
  };

  const togglePage = () => {
    const next = new Set(selection);
    for (const id of onPage) {
      if (allOnPage) next.delete(id);
      else next.add(id);
    }
    onSelectionChange(next);
  };

  const header = (c: Column): ReactNode => {
    if (!c.sort) return c.label;
    const active = sort === c.sort;
    const nextDir = active ? (dir === 'asc' ? 'desc' : 'asc') : (c.firstDir ?? 'asc');
    return (
      <button
        type="button"
        onClick={() => onSort(c.sort!, nextDir)}
        className={cx('ledger-label inline-flex items-center gap-1 hover:text-ink', active && 'text-ink', c.numeric && 'flex-row-reverse')}
      >
        {c.label}
        <span aria-hidden="true" className={cx('text-[0.65rem]', !active && 'opacity-30')}>
          {active ? (dir === 'asc' ? '▲' : '▼') : '▲▼'}
        </span>
        <span className="sr-only">{active ? `, sorted ${dir === 'asc' ? 'ascending' : 'descending'}; ` : ', '}sort {nextDir === 'asc' ? 'ascending' : 'descending'}</span>
      </button>
    );
  };

  return (
    <div className={cx('overflow-x-auto transition-opacity', stale && 'opacity-60')} aria-busy={stale || undefined}>
      <table className="w-full border-collapse text-left text-small tabular-nums" data-ledger>
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b-2 border-ink/70 bg-ledger">
          <tr>
            <th scope="col" className="w-8 px-2 py-2 align-bottom print:hidden">
              <input
                type="checkbox"
                aria-label={allOnPage ? 'Clear the selection on this page' : 'Select every member on this page'}
                checked={allOnPage}
                ref={(el) => {
                  if (el) el.indeterminate = selectedOnPage > 0 && !allOnPage;
                }}
                onChange={togglePage}
                className="size-4 accent-copper"
              />
            </th>
            {COLUMNS.map((c) => (
              <th
                key={c.key}
                scope="col"
                aria-sort={c.sort && sort === c.sort ? (dir === 'asc' ? 'ascending' : 'descending') : undefined}
                className={cx('ledger-label px-2 py-2 align-bottom whitespace-nowrap', c.numeric && 'text-right')}
              >
                {header(c)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {rows.map((m, index) => {
            const selected = selection.has(m.globalId);
            return (
              <tr key={m.globalId} data-global-id={m.globalId} aria-selected={selected} className={cx('align-top', selected ? 'bg-copper-wash' : 'hover:bg-paper')}>
                <td className="px-2 py-2 print:hidden">
                  <input
                    type="checkbox"
                    aria-label={`Select ${m.tag ?? m.globalId}`}
                    checked={selected}
                    onChange={() => undefined}
                    onClick={(event) => toggleRow(index, event)}
                    className="size-4 accent-copper"
                  />
                </td>
                <th scope="row" className="px-2 py-2 font-mono text-fine font-normal whitespace-nowrap">
                  <Link to={memberHref(m.globalId)}>{m.globalId}</Link>
                </th>
                <td className="px-2 py-2 font-semibold whitespace-nowrap">{m.tag ?? <span className="text-muted">—</span>}</td>
                <td className="min-w-40 px-2 py-2">{m.name ?? <span className="text-muted">—</span>}</td>
                <td className="px-2 py-2 text-muted">{m.ifcClass.replace(/^Ifc/, '')}</td>
                <td className="px-2 py-2 whitespace-nowrap">{m.profile ?? <span className="text-muted">—</span>}</td>
                <td className="px-2 py-2 whitespace-nowrap">{m.grade ?? <span className="text-muted">—</span>}</td>
                <td className="px-2 py-2 text-right">
                  <Figure measure={m.designForceN == null ? null : units.force(m.designForceN)} missing="none" />
                </td>
                <td className="px-2 py-2 text-right">
                  <Figure measure={m.designCapacityN == null ? null : units.force(m.designCapacityN)} />
                </td>
                <td className="px-2 py-2 text-right whitespace-nowrap">
                  <UtilisationFigure utilisation={m.utilisation} band={m.band} missing={m.designForceN == null ? 'no design force' : 'no result'} />
                </td>
                <td className="px-2 py-2 whitespace-nowrap">{m.governing ?? <span className="text-muted">—</span>}</td>
                <td className="px-2 py-2">
                  <BandTag band={m.band} />
                </td>
                <td className="px-2 py-2 text-right">{m.warningCount > 0 ? m.warningCount : <span className="text-muted">0</span>}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
