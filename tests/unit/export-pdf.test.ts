// The PDF calculation report, read back as text with pdf-parse (an independent reader).
import { beforeAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { CAUTIONS } from '../../shared/api/cautions';
import { writePdfReport } from '../../server/exports/pdf-report';
import { governingEndIndex } from '../../server/exports/pdf-member';
import type { ExportBundle } from '../../server/exports/export-bundle';
import { sampleBundle } from '../support/export-fixture';

let bundle: ExportBundle;
let pdf: Buffer;
let text: string;
let pages: number;
const flat = (s: string) => s.replace(/\s+/g, ' ');

beforeAll(async () => {
  bundle = await sampleBundle();
  pdf = await writePdfReport(bundle);
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  const out = await parser.getText();
  await parser.destroy();
  text = flat(out.text);
  pages = out.total;
}, 120_000);

describe('PDF calculation report', () => {
  it('is a PDF with a cover, a summary and at least one page per member', () => {
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pages).toBeGreaterThanOrEqual(bundle.members.length + 2);
  });

  it('renders φ, ≤, ≥ and ² as text (embedded fonts carry those glyphs)', () => {
    for (const ch of ['φ', '≤', '≥', '²']) expect(text).toContain(ch);
    expect(text).not.toMatch(/\?{2,}/);
  });

  it('carries project, revision, standard and edition, engine version, units, dates and every caution', () => {
    for (const s of ['Kestrel Yard maintenance shed', 'revision 1', 'AS 4100', 'AS 4100-1998 incl. Amdt 1:2012', `engine ${bundle.engineVersion}`, 'forces kN', bundle.generatedAt, bundle.revision.checkedAt]) expect(text).toContain(s);
    for (const c of CAUTIONS) expect(text).toContain(flat(c));
  });

  it('has, for each member, its GlobalId, trace steps with clauses, assumed values and warnings', () => {
    for (const m of bundle.members) {
      expect(text).toContain(m.row.globalId);
      const at = text.indexOf(`GlobalId ${m.row.globalId}`);
      expect(at).toBeGreaterThan(0);
      const next = bundle.members.map((o) => text.indexOf(`GlobalId ${o.row.globalId}`)).filter((i) => i > at).sort((a, b) => a - b)[0] ?? text.length;
      const section = text.slice(at, next);
      for (const step of m.result!.trace) expect(section).toContain(flat(step.clause));
      expect(section).toContain('Assumed values');
      expect(section).toContain('Warnings');
      expect(section).toContain(`fy = ${m.detail.steel!.fy}`);
      for (const w of m.row.warnings) expect(section).toContain(flat(w).slice(0, 40));
    }
  });

  it('draws the bolted ends and names the governing chain of the governing end', () => {
    const withHoles = bundle.members.filter((m) => m.detail.ends.some((e) => e.holes.length) && m.result?.net.governing);
    expect(withHoles.length).toBeGreaterThan(0);
    for (const m of withHoles) {
      expect(governingEndIndex(m)).toBeGreaterThanOrEqual(0);
      expect(text).toContain(`governing chain through holes ${m.result!.net.governing!.holes.join(', ')}`);
    }
    expect(text).toContain('developed width');
  });
});
