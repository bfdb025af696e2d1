/**
 * Fonts of the PDF report. The Noto Sans subsets split the alphabet: latin lacks φ and
 * ≤ ≥, greek has φ γ Ω, and only Noto Sans Math has ≤ ≥ √ →. pdfkit reads .woff (not
 * .woff2). Text is cut into runs, each set in the first font that has its glyphs.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import * as fontkit from 'fontkit';

const require = createRequire(import.meta.url);
const notoDir = path.join(path.dirname(require.resolve('@fontsource/noto-sans/package.json')), 'files');
const mathDir = path.join(path.dirname(require.resolve('@fontsource/noto-sans-math/package.json')), 'files');

export type Weight = 'regular' | 'bold';

interface FontFile {
  /** Name registered with pdfkit. */
  name: string;
  data: Buffer;
  has: (codePoint: number) => boolean;
}

const loaded = new Map<string, FontFile>();

function font(name: string, file: string): FontFile {
  let f = loaded.get(name);
  if (!f) {
    const data = readFileSync(file);
    const face = fontkit.create(data) as { hasGlyphForCodePoint(cp: number): boolean };
    f = { name, data, has: (cp) => face.hasGlyphForCodePoint(cp) };
    loaded.set(name, f);
  }
  return f;
}

const chains = new Map<Weight, FontFile[]>();

/** Fallback chains, most common first. Math has no bold face; its regular stands in. */
function chain(weight: Weight): FontFile[] {
  let c = chains.get(weight);
  if (!c) chains.set(weight, (c = buildChain(weight)));
  return c;
}

function buildChain(weight: Weight): FontFile[] {
  const w = weight === 'bold' ? 700 : 400;
  return [
    font(`latin-${w}`, path.join(notoDir, `noto-sans-latin-${w}-normal.woff`)),
    font(`latin-ext-${w}`, path.join(notoDir, `noto-sans-latin-ext-${w}-normal.woff`)),
    font(`greek-${w}`, path.join(notoDir, `noto-sans-greek-${w}-normal.woff`)),
    font('math-400', path.join(mathDir, 'noto-sans-math-latin-400-normal.woff')),
  ];
}

/** Registers every face with a document (pdfkit embeds only the glyphs used). */
export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const f of [...chain('regular'), ...chain('bold')]) doc.registerFont(f.name, f.data);
  doc.font(chain('regular')[0].name);
}

export interface Run {
  font: string;
  text: string;
}

/** First font of the chain with the glyph, per weight and code point (asked once each). */
const choice = new Map<number, FontFile | null>();
function fontFor(weight: Weight, cp: number): FontFile | null {
  const key = weight === 'bold' ? -cp - 1 : cp;
  let f = choice.get(key);
  if (f === undefined) {
    f = chain(weight).find((x) => x.has(cp)) ?? null;
    choice.set(key, f);
  }
  return f;
}

/** Splits text into runs of one font each; a character no font has becomes "?". */
export function runsOf(text: string, weight: Weight = 'regular'): Run[] {
  const fonts = chain(weight);
  const runs: Run[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    // Spaces and combining marks stay with the run before them.
    const keep = runs.length && (cp === 0x20 || (cp >= 0x300 && cp <= 0x36f));
    const f = keep ? null : fontFor(weight, cp);
    const name = f?.name ?? (keep ? runs[runs.length - 1].font : fonts[0].name);
    const glyph = f || keep ? ch : '?';
    const last = runs[runs.length - 1];
    if (last && last.font === name) last.text += glyph;
    else runs.push({ font: name, text: glyph });
  }
  return runs;
}

/** Width of mixed-font text at the current size. */
export function widthOf(doc: PDFKit.PDFDocument, text: string, weight: Weight = 'regular'): number {
  let w = 0;
  for (const r of runsOf(text, weight)) w += doc.font(r.font).widthOfString(r.text);
  return w;
}

/**
 * Writes mixed-font text as one flowing paragraph (pdfkit wraps across the runs).
 * With x/y it starts there; otherwise it continues at the cursor.
 */
export function write(doc: PDFKit.PDFDocument, text: string, opts: PDFKit.Mixins.TextOptions & { x?: number; y?: number; weight?: Weight } = {}): void {
  const { x, y, weight = 'regular', ...rest } = opts;
  const runs = runsOf(text || ' ', weight);
  runs.forEach((r, i) => {
    doc.font(r.font);
    const more = i < runs.length - 1;
    if (i === 0 && x !== undefined) doc.text(r.text, x, y, { ...rest, continued: more });
    else doc.text(r.text, { ...rest, continued: more });
  });
  doc.font(chain('regular')[0].name);
}
