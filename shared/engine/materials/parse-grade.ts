import { AS3678, AS3679, ASTM, EN10025, EN1993_TABLE_3_1, bandFor, type GradeTable } from './grade-tables.ts';

/** Resolved steel strengths (MPa) with where they came from. */
export interface Steel {
  fy: number;
  fu: number;
  /** Canonical grade name, e.g. "S355", "AS/NZS 3679.1-300", or "user" for explicit values. */
  grade: string;
  /** Standard/table the values were read from, or "explicit fy/fu". */
  source: string;
  /** The text the grade was parsed from, if any. */
  text?: string;
}

export interface SteelOptions {
  /** Product form, to pick AS/NZS 3678 (plate) or 3679.1 (sections, bars) for a bare "Grade 300". Default 'section'. */
  product?: 'plate' | 'section';
  /** EN grades: product standard EN 10025-2 (default) or EN 1993-1-1 Table 3.1 — a National Annex choice. */
  enSource?: 'product-standard' | 'table-3.1';
}

/**
 * Identify a grade name as models spell it ("S355JR", "STEEL/S235JR", "ASTM A36",
 * "A992", "Grade 300", "300PLUS", "AS/NZS 3679.1-300", "Gr50", "A572-50" …).
 * Returns the table, or null when the text is not recognised. Sub-grade letters
 * (JR, J0, J2, K2, +N, L0 …) are ignored: they govern toughness, not strength.
 */
export function identifyGrade(text: string, opts: SteelOptions = {}): GradeTable | null {
  const s = text.toUpperCase().replace(/\s+/g, ' ').trim();
  const en = /(?:^|[^A-Z0-9])S ?(235|275|355)(?![0-9])/.exec(s) ?? /^S(235|275|355)/.exec(s.replace(/^.*[/:]/, ''));
  if (en) return (opts.enSource === 'table-3.1' ? EN1993_TABLE_3_1 : EN10025)[`S${en[1]}`];
  if (/A ?36(?![0-9])/.test(s)) return ASTM.A36;
  if (/A ?992/.test(s)) return ASTM.A992;
  if (/A ?572/.test(s)) return /50/.test(s.replace(/A ?572/, '')) ? ASTM['A572-50'] : null;
  if (/^(?:.*[^0-9])?GR(?:ADE)?\.? ?50$/.test(s)) return ASTM['A572-50'];
  const as79 = /3679(?:\.1)?\D*(300|350)/.exec(s);
  if (as79) return AS3679[as79[1]];
  const as78 = /3678\D*(250|300|350)/.exec(s);
  if (as78) return AS3678[as78[1]];
  const plus = /(?:^|[^0-9])(300|350)\s?PLUS/.exec(s);
  if (plus) return AS3679[plus[1]];
  const bare = /^(?:.*[/ ])?(?:G|GR|GRADE)?\.? ?(250|300|350)(?:L0|L15|L20|L40)?$/.exec(s);
  if (bare) {
    if (bare[1] === '250') return AS3678['250'];
    return (opts.product === 'plate' ? AS3678 : AS3679)[bare[1]];
  }
  return null;
}

/**
 * Steel strengths (MPa) for a grade name at element thickness t (mm).
 * Throws RangeError naming the problem when the grade is unknown or t is past the table.
 */
export function steelFromGrade(text: string, t: number, opts: SteelOptions = {}): Steel {
  const table = identifyGrade(text, opts);
  if (!table) throw new RangeError(`unknown steel grade "${text}"`);
  const band = bandFor(table, t);
  if (!band) throw new RangeError(`grade ${table.grade} has no strength listed for t = ${t} mm`);
  return { fy: band.fy, fu: band.fu, grade: table.grade, source: `${table.standard}, t = ${fmt(t)} mm`, text };
}

/**
 * Resolve a steel spec: explicit fy/fu (MPa) win over the grade's values, each on its own.
 * With neither a grade nor both strengths, throws RangeError.
 */
export function resolveSteel(spec: { grade?: string; fy?: number; fu?: number }, t: number, opts: SteelOptions = {}): Steel {
  if (spec.grade) {
    const base = steelFromGrade(spec.grade, t, opts);
    if (spec.fy === undefined && spec.fu === undefined) return base;
    return { ...base, fy: spec.fy ?? base.fy, fu: spec.fu ?? base.fu, source: `${base.source}; explicit ${[spec.fy !== undefined && 'fy', spec.fu !== undefined && 'fu'].filter(Boolean).join(' and ')} override` };
  }
  if (spec.fy === undefined || spec.fu === undefined) throw new RangeError('steel needs a grade or both fy and fu');
  return { fy: spec.fy, fu: spec.fu, grade: 'user', source: 'explicit fy/fu' };
}

function fmt(v: number): string {
  return String(Math.round(v * 100) / 100);
}
