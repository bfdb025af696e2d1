import { parse } from 'csv-parse/sync';

/** Force columns accepted, with the factor to N. Tension positive in every unit. */
export const FORCE_COLUMNS: Record<string, number> = {
  'N [kN]': 1000,
  'N [kip]': 4448.2216152605,
  'N [N]': 1,
};

export interface ForceRow {
  /** 1-based line number in the file (header is line 1). */
  line: number;
  globalId: string | null;
  tag: string | null;
  loadCase: string;
  /** Axial force, N, tension positive. */
  axialN: number;
}

export interface ForcesProblem {
  line: number;
  message: string;
}

export interface ParsedForces {
  unit: string;
  rows: ForceRow[];
  problems: ForcesProblem[];
}

/** Beyond this a value is taken as a unit slip (e.g. N typed into a kN column), not a force. */
const ABSURD_N = 1e9;

const norm = (h: string) => h.replace(/^\uFEFF/, '').trim();

/**
 * Reads a forces table: a header row with a `GlobalId` or `Tag` column, a `LoadCase`
 * column and one axial-force column named `N [kN]`, `N [kip]` or `N [N]`; other columns
 * are ignored. Returns every row it understood and a per-line list of problems; the
 * caller applies nothing when there is any problem.
 */
export function parseForcesCsv(text: string): ParsedForces {
  let records: string[][];
  // One delimiter per file, taken from the header row: with several at once, a decimal comma
  // in a semicolon-separated file ("12,5") would split into two cells and read as 12.
  const headerLine = text.replace(/^\uFEFF/, '').split(/\r?\n/, 1)[0];
  const delimiter = headerLine.includes(';') ? ';' : headerLine.includes('\t') ? '\t' : ',';
  try {
    records = parse(text, { delimiter, relax_column_count: true, skip_empty_lines: true, trim: true, bom: true });
  } catch (err) {
    return { unit: '', rows: [], problems: [{ line: 0, message: `The file is not a readable CSV table (${(err as Error).message}).` }] };
  }
  if (!records.length) return { unit: '', rows: [], problems: [{ line: 0, message: 'The file is empty.' }] };
  const header = records[0].map(norm);
  const find = (name: string) => header.findIndex((h) => h.toLowerCase() === name.toLowerCase());
  const gid = find('GlobalId');
  const tag = find('Tag');
  const lc = find('LoadCase');
  const forceCols = header.filter((h) => h in FORCE_COLUMNS);
  const headerProblems: string[] = [];
  if (gid < 0 && tag < 0) headerProblems.push('a "GlobalId" or "Tag" column');
  if (lc < 0) headerProblems.push('a "LoadCase" column');
  if (forceCols.length !== 1) headerProblems.push(`exactly one force column named ${Object.keys(FORCE_COLUMNS).map((c) => `"${c}"`).join(', ')}${forceCols.length > 1 ? ` (found ${forceCols.join(', ')})` : ''}`);
  if (headerProblems.length) {
    return { unit: '', rows: [], problems: [{ line: 1, message: `The header row needs ${headerProblems.join('; ')}. Found: ${header.join(', ') || 'nothing'}.` }] };
  }
  const unit = forceCols[0];
  const fi = header.indexOf(unit);
  const rows: ForceRow[] = [];
  const problems: ForcesProblem[] = [];
  const seen = new Map<string, number>();
  records.slice(1).forEach((rec, i) => {
    const line = i + 2;
    const g = gid >= 0 ? (rec[gid] ?? '').trim() : '';
    const t = tag >= 0 ? (rec[tag] ?? '').trim() : '';
    const loadCase = (rec[lc] ?? '').trim();
    const raw = (rec[fi] ?? '').trim().replace(',', '.');
    // More filled cells than the header names: most likely a decimal comma in a comma-separated file.
    if (rec.slice(header.length).some((c) => c.trim() !== '')) {
      return problems.push({ line, message: `the row has more cells than the header; write decimals with a point, or separate columns with ";"` });
    }
    if (!g && !t) return problems.push({ line, message: 'no GlobalId or Tag' });
    if (g && !/^[0-9A-Za-z_$]{22}$/.test(g)) return problems.push({ line, message: `"${g}" is not an IFC GlobalId (22 characters)` });
    if (!loadCase) return problems.push({ line, message: 'no LoadCase' });
    const value = Number(raw);
    if (raw === '' || !Number.isFinite(value)) return problems.push({ line, message: `the force "${raw}" is not a number` });
    const axialN = value * FORCE_COLUMNS[unit];
    if (Math.abs(axialN) > ABSURD_N) return problems.push({ line, message: `the force ${raw} ${unit.slice(3, -1)} is beyond any building member; check the unit` });
    const key = `${g || `tag:${t}`}|${loadCase}`;
    if (seen.has(key)) return problems.push({ line, message: `duplicates line ${seen.get(key)} (same member and load case)` });
    seen.set(key, line);
    rows.push({ line, globalId: g || null, tag: t || null, loadCase: loadCase.slice(0, 120), axialN });
  });
  if (!rows.length && !problems.length) problems.push({ line: 1, message: 'The file has a header but no rows.' });
  return { unit, rows, problems };
}

/** The design force of a member: the largest tension over its load cases (N), or null. */
export function tensionEnvelope(forces: { loadCase: string; axialN: number }[]): { axialN: number; loadCase: string } | null {
  let best: { axialN: number; loadCase: string } | null = null;
  for (const f of forces) if (f.axialN > 0 && (!best || f.axialN > best.axialN)) best = { axialN: f.axialN, loadCase: f.loadCase };
  return best;
}
