/**
 * The plain data every export writer takes. Writers never touch the database or the
 * file store: the routes and the command line build a bundle, the writers turn it into
 * bytes. Units inside a bundle are the engine's (N, mm, mm², MPa); writers convert.
 */
import type { CheckResult } from '@shared/engine/checks/types';
import type { MemberDetail } from '@shared/api/member-detail';
import type { ResultBand } from '@shared/api/results';
import type { StandardId } from '@shared/api/projects';

/** Summary columns of one member, as the member table shows them. */
export interface ExportRow {
  globalId: string;
  tag: string | null;
  name: string | null;
  ifcClass: string;
  storey: string | null;
  profile: string | null;
  grade: string | null;
  holeCount: number;
  lengthMm: number | null;
  /** N, tension positive; null when no force is known. */
  designForceN: number | null;
  forceSource: string | null;
  netAreaMm2: number | null;
  /** N */
  designCapacityN: number | null;
  utilisation: number | null;
  governing: string | null;
  band: ResultBand;
  warnings: string[];
}

export interface ExportMember {
  row: ExportRow;
  result: CheckResult | null;
  detail: MemberDetail;
}

export interface ExportBundle {
  project: { name: string };
  /** The model's name in the project (falls back to the file name). */
  model: { name: string };
  revision: { number: number; fileName: string; standard: StandardId; checkedAt: string };
  /** ISO 8601 */
  generatedAt: string;
  engineVersion: string;
  /** Plain words for the filter that chose the members, e.g. "tension members with a result". */
  filterDescription: string;
  members: ExportMember[];
}

/** Bands a BCF export lists when the caller gives no filter of its own. */
export const CRITICAL_BANDS: ResultBand[] = ['tight', 'over'];

/** Units used in every export; one place so headers, sheets and reports agree. */
export const EXPORT_UNITS = {
  force: 'kN',
  area: 'mm²',
  length: 'mm',
  stress: 'MPa',
  utilisation: 'design force / design capacity (dimensionless)',
} as const;

export const kN = (n: number | null | undefined): number | null => (n == null || !Number.isFinite(n) ? null : n / 1000);

/** The member's label for people: tag, else name, else GlobalId. */
export function memberLabel(row: Pick<ExportRow, 'tag' | 'name' | 'globalId'>): string {
  if (row.tag && row.name) return `${row.tag} ${row.name}`;
  return row.tag ?? row.name ?? row.globalId;
}
