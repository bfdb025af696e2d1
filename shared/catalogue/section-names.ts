/**
 * Turns the section names models carry ('L200/200/24', 'STRIP15*100', 'HOEK 50 X 50 X 5',
 * 'K70/70/4', 'HEB220', 'L4X4X1/2', …) into a Section. Many detailing exports give the
 * section only as a name on a faceted body, so this is the only way to know its size there.
 * Unknown or ambiguous names return null rather than a guess.
 */
import type { Section } from '../engine/section-types.ts';
import { rolledSection } from './rolled-sections.ts';

const INCH = 25.4;

/** '1/2' → 0.5, '1-1/2' → 1.5, '6.0' → 6; NaN when not a number. */
function parseNumber(token: string): number {
  const t = token.trim();
  const mixed = /^(\d+)-(\d+)\/(\d+)$/.exec(t);
  if (mixed) return Number(mixed[1]) + Number(mixed[2]) / Number(mixed[3]);
  const frac = /^(\d+)\/(\d+)$/.exec(t);
  if (frac) return Number(frac[1]) / Number(frac[2]);
  return /^\d+(\.\d+)?$/.test(t) ? Number(t) : NaN;
}

/**
 * Splits the dimension part into numbers. 'X' or '*' separate dimensions when present, so
 * '/' can then be a fraction (L4X4X1/2); otherwise '/' separates (L200/200/24).
 */
function dimensions(rest: string): { values: number[]; hadFraction: boolean } | null {
  const s = rest.replace(/MM$/, '').trim();
  if (!s) return null;
  let tokens: string[];
  let hadFraction = false;
  if (/[X*×]/.test(s)) {
    tokens = s.split(/\s*[X*×]\s*/);
    hadFraction = tokens.some((t) => t.includes('/'));
  } else {
    tokens = s.split(/\s*\/\s*/);
  }
  const values = tokens.map(parseNumber);
  if (values.some((v) => !Number.isFinite(v) || v <= 0)) return null;
  return { values, hadFraction };
}

const round2 = (v: number) => Math.round(v * 100) / 100;

function normalise(name: string): string {
  return name
    .toUpperCase()
    .replace(/,/g, '.')
    .replace(/\s+/g, ' ')
    .trim();
}

type Parser = (prefix: string, dims: number[], inches: boolean) => Section | null;

const angle: Parser = (_p, d, inches) => {
  const k = inches ? INCH : 1;
  if (d.length === 3) return { shape: 'angle', legA: round2(d[0] * k), legB: round2(d[1] * k), thickness: round2(d[2] * k) };
  if (d.length === 2) return { shape: 'angle', legA: round2(d[0] * k), legB: round2(d[0] * k), thickness: round2(d[1] * k) };
  return null;
};

const flat: Parser = (_p, d, inches) => {
  if (d.length !== 2) return null;
  const k = inches ? INCH : 1;
  // Exports write both 'width x thickness' and 'thickness x width' ('STRIP15*100', 'PL10x100').
  return { shape: 'flat', width: round2(Math.max(...d) * k), thickness: round2(Math.min(...d) * k) };
};

const roundBar: Parser = (_p, d, inches) => (d.length === 1 ? { shape: 'round-bar', diameter: round2(d[0] * (inches ? INCH : 1)) } : null);

const chs: Parser = (_p, d, inches) => {
  if (d.length !== 2 || d[1] >= d[0] / 2) return null;
  const k = inches ? INCH : 1;
  return { shape: 'chs', diameter: round2(d[0] * k), thickness: round2(d[1] * k) };
};

const hollowRect: Parser = (_p, d, inches) => {
  const k = inches ? INCH : 1;
  if (d.length === 3) return { shape: 'rhs', depth: round2(d[0] * k), width: round2(d[1] * k), thickness: round2(d[2] * k) };
  if (d.length === 2) return { shape: 'rhs', depth: round2(d[0] * k), width: round2(d[0] * k), thickness: round2(d[1] * k) };
  return null;
};

/** Longest prefixes first so 'CHS' wins over 'C', 'RHS' over 'R'. */
const SHAPED_PREFIXES: [RegExp, Parser][] = [
  [/^(CHS|PIPE|RO|B)\s*(?=\d)/, chs],
  [/^(SHS|RHS|HSS|QRO|RRO|K)\s*(?=\d)/, hollowRect],
  [/^(HOEK|ANGLE|EA|UA|RSA|L)\s*(?=\d)/, angle],
  [/^(STRIP|FLAT|FLAT BAR|FL|FB|PLATE|PL|PLT)\s*(?=\d)/, flat],
  [/^(ROD M|ROD|ROUND|RD|RND|R|Ø|⌀|M)\s*(?=\d)/, roundBar],
];

function rolled(s: string): Section | null {
  const compact = s.replace(/\s+/g, '');
  let m = /^(IPE|HEA|HEB|UPN|UPE)(\d+)$/.exec(compact);
  if (m) return rolledSection(m[1], m[2]);
  m = /^HE(\d+)([AB])$/.exec(compact);
  if (m) return rolledSection(`HE${m[2]}`, m[1]);
  m = /^(UB|UC|PFC)(\d+X\d+X\d+(?:\.\d+)?)$/.exec(compact) ?? /^(\d+X\d+X\d+(?:\.\d+)?)(UB|UC|PFC)$/.exec(compact);
  if (m) return /^\d/.test(m[1]) ? rolledSection(m[2], m[1]) : rolledSection(m[1], m[2]);
  m = /^(W|C)(\d+X\d+(?:\.\d+)?)$/.exec(compact);
  if (m) return rolledSection(m[1], m[2]);
  return null;
}

/** Parses a section name; null when the name is not recognised. */
export function parseSectionName(name: string | null | undefined): Section | null {
  if (!name) return null;
  const s = normalise(name);
  const fromTable = rolled(s);
  if (fromTable) return fromTable;
  for (const [re, parse] of SHAPED_PREFIXES) {
    const m = re.exec(s);
    if (!m) continue;
    const dims = dimensions(s.slice(m[0].length));
    if (!dims) return null;
    // Inch names use fractions (L4X4X1/2, HSS6X6X1/4) or, for angles, small whole numbers (L3X3X0.25);
    // metric angles have legs of 20 mm and more.
    const inches =
      dims.hadFraction || m[1] === 'HSS' || (parse === angle && Math.max(...dims.values) <= 8);
    return parse(m[1], dims.values, inches);
  }
  return null;
}
