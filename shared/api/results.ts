/**
 * Result bands: our own names for utilisation ranges. Thresholds are settings; these are
 * the defaults. One function decides the band, so the 3D colours, legend, tables, charts
 * and exports always agree.
 */
export const RESULT_BANDS = ['spare', 'working', 'tight', 'over', 'unknown'] as const;
export type ResultBand = (typeof RESULT_BANDS)[number];

export interface BandThresholds {
  /** Upper bound of `spare` (exclusive). */
  working: number;
  /** Upper bound of `working` (exclusive). */
  tight: number;
  /** Utilisation above this is `over`. */
  over: number;
}
export const DEFAULT_BAND_THRESHOLDS: BandThresholds = { working: 0.6, tight: 0.85, over: 1.0 };

export const BAND_STYLE: Record<ResultBand, { label: string; colour: string; description: string }> = {
  spare: { label: 'spare', colour: '#EDE3C8', description: 'utilisation below 0.60' },
  working: { label: 'working', colour: '#D08C2C', description: 'utilisation 0.60 to 0.85' },
  tight: { label: 'tight', colour: '#A8432A', description: 'utilisation 0.85 to 1.00' },
  over: { label: 'over', colour: '#5A1846', description: 'utilisation above 1.00' },
  unknown: { label: 'no result', colour: '#8FA3B0', description: 'no design force or missing input' },
};

/** Band of a utilisation (dimensionless, design force / design capacity); null or non-finite → unknown. */
export function bandOf(utilisation: number | null | undefined, t: BandThresholds = DEFAULT_BAND_THRESHOLDS): ResultBand {
  if (utilisation == null || !Number.isFinite(utilisation)) return 'unknown';
  if (utilisation > t.over) return 'over';
  if (utilisation >= t.tight) return 'tight';
  if (utilisation >= t.working) return 'working';
  return 'spare';
}
