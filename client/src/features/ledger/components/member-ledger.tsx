import { BAND_STYLE, type ResultBand } from '@shared/api';
import { formatCount } from '../../../lib/format';
import { Button, EmptyState, ErrorState, LoadingState, Select } from '../../../ui';
import { useMemberPage } from '../api/use-member-page';
import { useMemberFacets } from '../api/use-member-facets';
import { filterParams, PAGE_SIZES, useLedgerParams } from '../hooks/use-ledger-params';
import { LedgerFilters } from './ledger-filters';
import { MemberTable } from './member-table';
import { ExportLinks } from './export-links';

export interface MemberLedgerProps {
  projectId: number;
  revisionId: number;
  /** The selected members' GlobalIds, owned by the page (shared with other views of the revision). */
  selection: ReadonlySet<string>;
  onSelectionChange: (next: ReadonlySet<string>) => void;
  memberHref: (globalId: string) => string;
  /** Engineers and admins get export links. */
  canExport: boolean;
}

/** The member ledger with its filters, paging and exports; the view is kept in the address. */
export function MemberLedger({ projectId, revisionId, selection, onSelectionChange, memberHref, canExport }: MemberLedgerProps) {
  const { view, update } = useLedgerParams();
  const filters = filterParams(view, selection);
  const page = useMemberPage(projectId, revisionId, { ...filters, page: String(view.page), pageSize: String(view.pageSize) });
  const facets = useMemberFacets(projectId, revisionId);
  const data = page.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const from = data && data.total > 0 ? (data.page - 1) * data.pageSize + 1 : 0;
  const to = data ? Math.min(data.total, data.page * data.pageSize) : 0;

  return (
    <div className="flex flex-col gap-4">
      <div className="no-print">
        <LedgerFilters
          view={view}
          onChange={update}
          classes={facets.data?.classes ?? []}
          profiles={facets.data?.profiles ?? []}
          selectedCount={selection.size}
          onClearSelection={() => {
            onSelectionChange(new Set());
            if (view.onlySelected) update({ onlySelected: false });
          }}
        />
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3 border-t border-rule pt-3">
        <p className="text-small" aria-live="polite">
          {data ? (
            data.total === 0 ? (
              'No members match.'
            ) : (
              <>
                Members <span className="figures font-semibold">{formatCount(from)}</span>–<span className="figures font-semibold">{formatCount(to)}</span> of{' '}
                <span className="figures font-semibold">{formatCount(data.total)}</span>
                {view.bands.length > 0 && <span className="text-muted"> in {view.bands.map((b: ResultBand) => BAND_STYLE[b].label).join(', ')}</span>}
              </>
            )
          ) : (
            ' '
          )}
        </p>
        {canExport && <ExportLinks projectId={projectId} revisionId={revisionId} filters={filters} />}
      </div>
      {page.isPending ? (
        <LoadingState label="Loading members…" />
      ) : page.isError && !data ? (
        <ErrorState title="The members could not be loaded" error={page.error} onRetry={() => void page.refetch()} />
      ) : data && data.members.length === 0 ? (
        <EmptyState title="No members match these filters">Clear a filter or widen the search to see more.</EmptyState>
      ) : data ? (
        <MemberTable
          rows={data.members}
          sort={view.sort}
          dir={view.dir}
          onSort={(sort, dir) => update({ sort, dir })}
          selection={selection}
          onSelectionChange={onSelectionChange}
          memberHref={memberHref}
          caption={`Members of this revision, sorted by ${view.sort} ${view.dir === 'asc' ? 'ascending' : 'descending'}, page ${data.page} of ${pages}`}
          stale={page.isPlaceholderData}
        />
      ) : null}
      {data && data.total > 0 && (
        <nav aria-label="Pages of members" className="no-print flex flex-wrap items-end justify-between gap-3">
          <div className="flex items-center gap-2">
            <Button variant="secondary" size="sm" disabled={view.page <= 1} onClick={() => update({ page: view.page - 1 })}>
              Previous page
            </Button>
            <span className="text-small">
              Page <span className="figures font-semibold">{view.page}</span> of <span className="figures">{pages}</span>
            </span>
            <Button variant="secondary" size="sm" disabled={view.page >= pages} onClick={() => update({ page: view.page + 1 })}>
              Next page
            </Button>
          </div>
          <Select
            label="Rows per page"
            compact
            className="w-36"
            value={String(view.pageSize)}
            onChange={(e) => update({ pageSize: Number(e.target.value) })}
            options={PAGE_SIZES.map((n) => ({ value: String(n), label: String(n) }))}
          />
        </nav>
      )}
    </div>
  );
}
