import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router';
import { MEMBER_SORT_KEYS, RESULT_BANDS, type MemberSortKey, type ResultBand } from '@shared/api';

/**
 * The ledger's view (filters, sort, page) lives in the address, so a view can be
 * bookmarked, shared, reloaded, and reached again with Back from a member sheet.
 */
export interface LedgerView {
  bands: ResultBand[];
  minUtilisation: string;
  ifcClass: string;
  profile: string;
  q: string;
  scope: 'tension' | 'all';
  sort: MemberSortKey;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
  /** Show only the selected members. */
  onlySelected: boolean;
}

export const PAGE_SIZES = [25, 50, 100, 250] as const;
const DEFAULT_PAGE_SIZE = 50;

function readView(params: URLSearchParams): LedgerView {
  const sort = params.get('sort') as MemberSortKey | null;
  const size = Number(params.get('size'));
  return {
    bands: (params.get('band') ?? '').split(',').filter((b): b is ResultBand => (RESULT_BANDS as readonly string[]).includes(b)),
    minUtilisation: params.get('min') ?? '',
    ifcClass: params.get('class') ?? '',
    profile: params.get('profile') ?? '',
    q: params.get('q') ?? '',
    scope: params.get('scope') === 'all' ? 'all' : 'tension',
    sort: sort && MEMBER_SORT_KEYS.includes(sort) ? sort : 'utilisation',
    dir: params.get('dir') === 'asc' ? 'asc' : 'desc',
    page: Math.max(1, Math.floor(Number(params.get('page')) || 1)),
    pageSize: (PAGE_SIZES as readonly number[]).includes(size) ? size : DEFAULT_PAGE_SIZE,
    onlySelected: params.get('only') === 'selected',
  };
}

function writeView(view: LedgerView): URLSearchParams {
  const p = new URLSearchParams();
  if (view.bands.length) p.set('band', view.bands.join(','));
  if (view.minUtilisation) p.set('min', view.minUtilisation);
  if (view.ifcClass) p.set('class', view.ifcClass);
  if (view.profile) p.set('profile', view.profile);
  if (view.q) p.set('q', view.q);
  if (view.scope !== 'tension') p.set('scope', view.scope);
  if (view.sort !== 'utilisation') p.set('sort', view.sort);
  if (view.dir !== 'desc') p.set('dir', view.dir);
  if (view.page > 1) p.set('page', String(view.page));
  if (view.pageSize !== DEFAULT_PAGE_SIZE) p.set('size', String(view.pageSize));
  if (view.onlySelected) p.set('only', 'selected');
  return p;
}

/** The filters as the API takes them (GET …/members and the exports), without paging. */
export function filterParams(view: LedgerView, selection: ReadonlySet<string>): Record<string, string> {
  const out: Record<string, string> = { sort: view.sort, dir: view.dir, scope: view.scope };
  if (view.bands.length) out.band = view.bands.join(',');
  const min = Number(view.minUtilisation);
  if (view.minUtilisation.trim() && Number.isFinite(min) && min >= 0) out.minUtilisation = String(min);
  if (view.ifcClass) out.ifcClass = view.ifcClass;
  if (view.profile.trim()) out.profile = view.profile.trim();
  if (view.q.trim()) out.q = view.q.trim();
  if (view.onlySelected) out.ids = [...selection].join(',');
  return out;
}

export function useLedgerParams() {
  const [params, setParams] = useSearchParams();
  const view = useMemo(() => readView(params), [params]);
  /** Change part of the view; any change but the page itself goes back to page 1. */
  const update = useCallback(
    (patch: Partial<LedgerView>) => {
      setParams(
        (prev) => {
          const current = readView(prev);
          const next = { ...current, ...patch };
          if (!('page' in patch)) next.page = 1;
          return writeView(next);
        },
        { replace: true, preventScrollReset: true },
      );
    },
    [setParams],
  );
  return { view, update, search: params.toString() };
}
