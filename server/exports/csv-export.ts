/**
 * CSV export: one header row (units in brackets), one row per member, nothing else, so any
 * spreadsheet or script reads it as a plain table. Because a CSV file must stand alone,
 * the standard, edition, engine version, dates and cautions are columns repeated on every
 * row (see docs/decisions/0005-export-formats.md).
 */
import { CAUTIONS } from '@shared/api/cautions';
import { BAND_STYLE } from '@shared/api/results';
import { kN, type ExportBundle } from './export-bundle';
import { assumptionsText, editionOf, fixed, standardLabel } from './export-text';

type Cell = string | number | null;

/** Header → cell of one member. Order here is the column order. */
const COLUMNS: [string, (m: ExportBundle['members'][number], b: ExportBundle) => Cell][] = [
  ['GlobalId', (m) => m.row.globalId],
  ['Tag', (m) => m.row.tag],
  ['Name', (m) => m.row.name],
  ['IFC class', (m) => m.row.ifcClass],
  ['Storey', (m) => m.row.storey],
  ['Profile', (m) => m.row.profile],
  ['Grade', (m) => m.row.grade],
  ['fy [MPa]', (m) => m.detail.steel?.fy ?? null],
  ['fu [MPa]', (m) => m.detail.steel?.fu ?? null],
  ['Holes', (m) => m.row.holeCount],
  ['Length [mm]', (m) => fixed(m.row.lengthMm, 0)],
  ['Gross area [mm²]', (m) => fixed(m.result?.grossArea, 1)],
  ['Net area [mm²]', (m) => fixed(m.row.netAreaMm2, 1)],
  ['Design force [kN]', (m) => fixed(kN(m.row.designForceN), 2)],
  ['Force source', (m) => m.row.forceSource],
  ['Design capacity [kN]', (m) => fixed(kN(m.row.designCapacityN), 2)],
  ['Utilisation [-]', (m) => fixed(m.row.utilisation, 3)],
  ['Governing mode', (m) => m.row.governing],
  ['Clause', (m) => m.result?.modes.find((x) => x.name === m.result?.governing)?.clause ?? null],
  ['Band', (m) => BAND_STYLE[m.row.band].label],
  ['Warnings', (m) => m.row.warnings.join(' | ')],
  ['Assumed values', (m) => assumptionsText(m)],
  ['Standard', (_m, b) => standardLabel(b.revision.standard)],
  ['Edition', (_m, b) => editionOf(b)],
  ['Engine version', (_m, b) => b.engineVersion],
  ['Revision', (_m, b) => b.revision.number],
  ['Checked at', (_m, b) => b.revision.checkedAt],
  ['Exported at', (_m, b) => b.generatedAt],
  ['Cautions', () => CAUTIONS.join(' ')],
];

export const CSV_HEADER = COLUMNS.map(([h]) => h);

/**
 * Quotes per RFC 4180. Text that a spreadsheet would run as a formula (=, +, -, @ first)
 * gets a leading apostrophe: names come from uploaded models and are not trusted.
 */
function cell(v: Cell): string {
  if (v === null || v === undefined) return '';
  let s = String(v);
  if (typeof v === 'string' && /^[=+\-@\t\r]/.test(s) && !/^-?\d+(\.\d+)?$/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** UTF-8 with a byte-order mark (spreadsheets then read ² and φ right), CRLF line ends. */
export function writeCsv(bundle: ExportBundle): Buffer {
  const lines = [CSV_HEADER.map(cell).join(',')];
  for (const m of bundle.members) lines.push(COLUMNS.map(([, get]) => cell(get(m, bundle))).join(','));
  return Buffer.from(`\uFEFF${lines.join('\r\n')}\r\n`, 'utf8');
}
