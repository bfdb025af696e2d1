import { useCallback, useSyncExternalStore } from 'react';

/**
 * The selected members of a revision: a set of IFC GlobalIds shared by every view of
 * that revision (the member ledger now; a 3D model view later). Kept per revision for
 * the browser tab (sessionStorage), so it survives opening a member sheet and coming back.
 */

const EMPTY: ReadonlySet<string> = new Set();
const sets = new Map<number, ReadonlySet<string>>();
const listeners = new Set<() => void>();
const storageKey = (revisionId: number) => `gaugeline.selection.${revisionId}`;

function load(revisionId: number): ReadonlySet<string> {
  const known = sets.get(revisionId);
  if (known) return known;
  let loaded: ReadonlySet<string> = EMPTY;
  try {
    const raw = window.sessionStorage.getItem(storageKey(revisionId));
    if (raw) loaded = new Set((JSON.parse(raw) as unknown[]).filter((v): v is string => typeof v === 'string'));
  } catch {
    // unreadable: start empty
  }
  sets.set(revisionId, loaded);
  return loaded;
}

export function setRevisionSelection(revisionId: number, next: ReadonlySet<string>): void {
  const value = next.size ? new Set(next) : EMPTY;
  sets.set(revisionId, value);
  try {
    if (value.size) window.sessionStorage.setItem(storageKey(revisionId), JSON.stringify([...value]));
    else window.sessionStorage.removeItem(storageKey(revisionId));
  } catch {
    // storage full or unavailable: the selection still lives for this page
  }
  listeners.forEach((l) => l());
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** [selected GlobalIds, replace the selection] for one revision. */
export function useRevisionSelection(revisionId: number): [ReadonlySet<string>, (next: ReadonlySet<string>) => void] {
  const selection = useSyncExternalStore(
    subscribe,
    () => load(revisionId),
    () => EMPTY,
  );
  const set = useCallback((next: ReadonlySet<string>) => setRevisionSelection(revisionId, next), [revisionId]);
  return [selection, set];
}

/** The ledger's last view (its query string) per revision, so a member sheet can link back to it. */
export function rememberLedgerSearch(revisionId: number, search: string): void {
  try {
    window.sessionStorage.setItem(`gaugeline.ledger.${revisionId}`, search.replace(/^\?/, ''));
  } catch {
    // not kept: the link goes back to the ledger's first page
  }
}

export function lastLedgerSearch(revisionId: number): string {
  try {
    return window.sessionStorage.getItem(`gaugeline.ledger.${revisionId}`) ?? '';
  } catch {
    return '';
  }
}
