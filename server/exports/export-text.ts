/**
 * Words and numbers shared by every export writer, so the CSV, the workbook, the report,
 * the BCF topics and the IFC property set say the same thing the same way.
 */
import { STANDARD_LABELS, type StandardId } from '@shared/api/projects';
import type { Assumption } from '@shared/engine/checks/types';
import type { ExportBundle, ExportMember } from './export-bundle';

/**
 * The edition each standard is checked to, as the engine documents its basis. AISC results
 * name their edition themselves (e.g. "AISC 360-16 LRFD"); that wins when present.
 */
const EDITION_BASIS: Record<StandardId, string> = {
  as4100: 'AS 4100:1998 incl. Amdt 1:2012 clause numbering; block shear to AS 4100:2020',
  'aisc360-lrfd': 'AISC 360-16, LRFD',
  'aisc360-asd': 'AISC 360-16, ASD',
  en1993: 'EN 1993-1-1:2005 and EN 1993-1-8:2005, recommended partial factors',
};

export function standardLabel(id: StandardId): string {
  return STANDARD_LABELS[id] ?? id;
}

/** The edition actually used: the engine's own statement if it gives one, else the documented basis. */
export function editionOf(bundle: Pick<ExportBundle, 'revision' | 'members'>): string {
  const stated = bundle.members.map((m) => m.result?.assumptions.find((a) => a.name === 'edition')?.value).find((v) => v != null);
  return stated != null ? String(stated) : EDITION_BASIS[bundle.revision.standard] ?? bundle.revision.standard;
}

/** "AS 4100 — AS 4100:1998 …": one line naming standard and edition. */
export function standardLine(bundle: Pick<ExportBundle, 'revision' | 'members'>): string {
  return `${standardLabel(bundle.revision.standard)} (${editionOf(bundle)})`;
}

/** Every value the check assumed, plus any engineer's override, as name/value/source rows. */
export function assumedValues(m: ExportMember): Assumption[] {
  const list: Assumption[] = [...(m.result?.assumptions ?? [])];
  if (m.detail.steel) {
    const s = m.detail.steel;
    list.push({ name: 'grade source', value: s.grade, source: s.fromDefault ? `project default grade (${s.source})` : s.source });
  }
  for (const [field, o] of Object.entries(m.detail.overrides ?? {})) {
    if (o) list.push({ name: `override ${field}`, value: o.value, source: `set by ${o.by} at ${o.at}: ${o.reason}` });
  }
  return list;
}

export function assumptionsText(m: ExportMember): string {
  return assumedValues(m).map((a) => `${a.name} = ${a.value} (${a.source})`).join('; ');
}

/** Resistance and partial factors in force (φ, γ, Ω), once per distinct value. */
export function factorSettings(bundle: Pick<ExportBundle, 'members'>): Assumption[] {
  const seen = new Map<string, Assumption>();
  for (const m of bundle.members) {
    for (const a of m.result?.assumptions ?? []) {
      if (!/^(φ|γ|Ω)/.test(a.name)) continue;
      const key = `${a.name}=${a.value}`;
      if (!seen.has(key)) seen.set(key, a);
    }
  }
  return [...seen.values()];
}

/** Fixed decimals, or empty for a missing value. */
export function fixed(v: number | null | undefined, decimals: number): string {
  return v == null || !Number.isFinite(v) ? '' : v.toFixed(decimals);
}

/** Date part of an ISO timestamp (YYYY-MM-DD). */
export const isoDate = (iso: string): string => iso.slice(0, 10);

/** A file name part: lower case letters, digits and single dashes only. */
export function slug(s: string, fallback = 'export'): string {
  const out = s
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/\.(ifczip|ifc)$/i, '')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/g, '');
  return out || fallback;
}
