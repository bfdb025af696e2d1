// CSV and workbook exports read back with independent readers (csv-parse, exceljs).
import { beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import ExcelJS from 'exceljs';
import { CAUTIONS } from '../../shared/api/cautions';
import { BAND_STYLE } from '../../shared/api/results';
import { writeCsv, CSV_HEADER } from '../../server/exports/csv-export';
import { writeXlsx } from '../../server/exports/xlsx-export';
import type { ExportBundle } from '../../server/exports/export-bundle';
import { sampleBundle } from '../support/export-fixture';

let bundle: ExportBundle;
beforeAll(async () => {
  bundle = await sampleBundle();
}, 120_000);

describe('CSV export', () => {
  it('is UTF-8 with a BOM, one header row with units, then one row per member and nothing else', () => {
    const buf = writeCsv(bundle);
    expect([...buf.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const rows: string[][] = parse(buf, { bom: true, relax_column_count: false });
    expect(rows[0]).toEqual(CSV_HEADER);
    expect(rows[0]).toEqual(expect.arrayContaining(['Design force [kN]', 'Design capacity [kN]', 'Net area [mm²]', 'Standard', 'Engine version', 'Exported at', 'Cautions']));
    expect(rows).toHaveLength(bundle.members.length + 1);
    expect(bundle.members.length).toBeGreaterThan(5);
  });

  it('carries every member by GlobalId with its numbers, assumptions, standard, engine, date and cautions', () => {
    const records: Record<string, string>[] = parse(writeCsv(bundle), { bom: true, columns: true });
    records.forEach((r, i) => {
      const m = bundle.members[i];
      expect(r.GlobalId).toBe(m.row.globalId);
      expect(Number(r['Design capacity [kN]'])).toBeCloseTo(m.row.designCapacityN! / 1000, 2);
      if (m.row.designForceN == null) expect(r['Design force [kN]']).toBe('');
      else expect(Number(r['Design force [kN]'])).toBeCloseTo(m.row.designForceN / 1000, 2);
      if (m.row.utilisation != null) expect(Number(r['Utilisation [-]'])).toBeCloseTo(m.row.utilisation, 3);
      expect(r.Band).toBe(BAND_STYLE[m.row.band].label);
      expect(r['Assumed values']).toContain('fy = ');
      expect(r.Standard).toBe('AS 4100');
      expect(r['Engine version']).toBe(bundle.engineVersion);
      expect(r['Exported at']).toBe(bundle.generatedAt);
      expect(r.Cautions).toBe(CAUTIONS.join(' '));
    });
    expect(records.some((r) => /φ = 0\.9/.test(r['Assumed values']))).toBe(true);
  });

  it('quotes commas and quotes, and defuses text a spreadsheet would run as a formula', () => {
    const m = bundle.members[0];
    const evil: ExportBundle = { ...bundle, members: [{ ...m, row: { ...m.row, name: '=HYPERLINK("http://x","y")', tag: 'A, "B"' } }] };
    const [rec] = parse(writeCsv(evil), { bom: true, columns: true }) as Record<string, string>[];
    expect(rec.Name).toBe(`'=HYPERLINK("http://x","y")`);
    expect(rec.Tag).toBe('A, "B"');
  });
});

describe('XLSX export', () => {
  let wb: ExcelJS.Workbook;
  beforeAll(async () => {
    wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await writeXlsx(bundle)) as never);
  });

  it('has Members, Assumptions and About sheets', () => {
    expect(wb.worksheets.map((w) => w.name)).toEqual(['Members', 'Assumptions', 'About']);
  });

  it('Members: frozen header, typed numbers with fixed decimals, band fill from the band style plus the word', () => {
    const ws = wb.getWorksheet('Members')!;
    expect(ws.views[0]).toMatchObject({ state: 'frozen', ySplit: 1 });
    const header = (ws.getRow(1).values as unknown[]).slice(1);
    const col = (name: string) => header.indexOf(name) + 1;
    expect(col('Utilisation [-]')).toBeGreaterThan(0);
    bundle.members.forEach((m, i) => {
      const row = ws.getRow(i + 2);
      expect(row.getCell(col('GlobalId')).value).toBe(m.row.globalId);
      const cap = row.getCell(col('Design capacity [kN]'));
      expect(typeof cap.value).toBe('number');
      expect(cap.value as number).toBeCloseTo(m.row.designCapacityN! / 1000, 6);
      expect(cap.numFmt).toBe('0.0');
      const u = row.getCell(col('Utilisation [-]'));
      expect(u.numFmt).toBe('0.00');
      if (m.row.utilisation != null) expect(u.value as number).toBeCloseTo(m.row.utilisation, 9);
      expect(row.getCell(col('Net area [mm²]')).numFmt).toBe('0');
      const band = row.getCell(col('Band'));
      expect(band.value).toBe(BAND_STYLE[m.row.band].label);
      expect((band.fill as ExcelJS.FillPattern).fgColor?.argb).toBe(`FF${BAND_STYLE[m.row.band].colour.slice(1).toUpperCase()}`);
    });
  });

  it('Assumptions: settings (standard, edition, factors) and each member’s assumed values', () => {
    const ws = wb.getWorksheet('Assumptions')!;
    const rows = ws.getSheetValues().slice(2).map((r) => (r as unknown[]).slice(1));
    const settings = rows.filter((r) => r[0] === '(all members)').map((r) => r[2]);
    expect(settings).toEqual(expect.arrayContaining(['standard', 'edition', 'φ']));
    for (const m of bundle.members) {
      const names = rows.filter((r) => r[0] === m.row.globalId).map((r) => r[2]);
      expect(names).toEqual(expect.arrayContaining(['fy', 'fu', 'grade source']));
    }
  });

  it('About: project, revision, dates, engine version, units, filter and every caution', () => {
    const ws = wb.getWorksheet('About')!;
    const text = ws.getSheetValues().map((r) => (r as unknown[] | undefined)?.slice(1).join(' ') ?? '').join('\n');
    for (const s of ['Kestrel Yard maintenance shed', bundle.generatedAt, bundle.revision.checkedAt, bundle.engineVersion, 'kN', 'mm²', bundle.filterDescription, ...CAUTIONS]) expect(text).toContain(s);
  });
});
