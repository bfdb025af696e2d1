// `gaugeline check` spawned as a user would run it, compared with the same pipeline run
// in-process, plus its behaviour on bad input (exit 2, one line on stderr).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import ExcelJS from 'exceljs';
import { CAUTIONS } from '../../shared/api/cautions';
import type { MemberRecord } from '../../server/imports/check-members';
import { ROOT, SAMPLE_FORCES, SAMPLE_IFC4, sampleRecords } from '../support/export-fixture';

interface Run {
  code: number | null;
  out: string;
  err: string;
  ms: number;
}

function gaugeline(args: string[], cwd = ROOT): Promise<Run> {
  const t0 = Date.now();
  return new Promise((resolve) => {
    execFile(process.execPath, [path.join(ROOT, 'bin/gaugeline.js'), 'check', ...args], { cwd, timeout: 120_000, maxBuffer: 64 * 1024 * 1024 }, (error, out, err) =>
      resolve({ code: error ? ((error as { code?: number }).code ?? null) : 0, out, err, ms: Date.now() - t0 }),
    );
  });
}

let dir: string;
let expected: MemberRecord[];
let withForces: Run;
beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'gaugeline-check-'));
  [expected, withForces] = await Promise.all([sampleRecords(SAMPLE_IFC4, 'as4100', true), gaugeline([SAMPLE_IFC4, '--forces', SAMPLE_FORCES, '--grade', 'AS/NZS 3679.1-300'])]);
}, 180_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('gaugeline check: results', () => {
  it('prints JSON whose numbers equal the in-process pipeline (kN, mm²), forces table applied', () => {
    expect(withForces.err).toBe('');
    expect(withForces.code).toBe(0);
    const o = JSON.parse(withForces.out);
    expect(o.schema).toMatch(/^gaugeline\.check\//);
    expect(o.units).toMatchObject({ force: 'kN', netArea: 'mm²' });
    expect(o.cautions).toEqual([...CAUTIONS]);
    expect(o.standard).toBe('AS 4100');
    const tension = expected.filter((r) => r.isTension);
    expect(o.members.map((m: { globalId: string }) => m.globalId).sort()).toEqual(tension.map((r) => r.globalId).sort());
    for (const r of tension) {
      const m = o.members.find((x: { globalId: string }) => x.globalId === r.globalId);
      expect(m).toMatchObject({ name: r.name, tag: r.tag, ifcClass: r.ifcClass, profile: r.profileName, grade: r.gradeName, holeCount: r.holeCount, governing: r.governing });
      expect(m.designCapacity).toBeCloseTo(r.designCapacityN! / 1000, 5);
      expect(m.netArea).toBeCloseTo(r.netAreaMm2!, 5);
      expect(m.force).toBeCloseTo(r.designForceN! / 1000, 5);
      expect(m.utilisation).toBeCloseTo(r.utilisation!, 5);
      expect(m.forceSource).toBe('forces-csv');
    }
  });

  it('gives null force and utilisation where no force is known', async () => {
    const r = await gaugeline([SAMPLE_IFC4, '--all']);
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    const noForce = o.members.filter((m: { force: number | null }) => m.force === null);
    expect(noForce.length).toBeGreaterThan(0);
    for (const m of noForce) expect(m.utilisation).toBeNull();
  }, 120_000);

  it('writes CSV to stdout and XLSX to --out, from any working directory', async () => {
    const out = path.join(dir, 'shed.xlsx');
    const [csv, xlsx] = await Promise.all([gaugeline([SAMPLE_IFC4, '--forces', SAMPLE_FORCES, '--format', 'csv'], tmpdir()), gaugeline([SAMPLE_IFC4, '--forces', SAMPLE_FORCES, '--format', 'xlsx', '--out', out], tmpdir())]);
    expect(csv.code).toBe(0);
    const rows: Record<string, string>[] = parse(csv.out, { bom: true, columns: true });
    const checked = expected.filter((r) => r.isTension && r.result);
    expect(rows.map((r) => r.GlobalId).sort()).toEqual(checked.map((r) => r.globalId).sort());
    expect(xlsx.code).toBe(0);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(readFileSync(out) as never);
    expect(wb.getWorksheet('Members')!.rowCount).toBe(checked.length + 1);
  }, 180_000);
});

describe('gaugeline check: bad input', () => {
  const cases: [string, () => string[], RegExp][] = [
    ['missing file', () => [path.join(dir, 'nope.ifc')], /no such file/],
    ['not IFC', () => [write('text.ifc', 'just some text\n')], /does not look like an IFC file/],
    ['empty file', () => [write('empty.ifc', '')], /empty/],
    ['truncated', () => [write('cut.ifc', readFileSync(SAMPLE_IFC4, 'latin1').slice(0, 4000))], /truncated|cut off/],
    ['unknown schema', () => [write('schema.ifc', readFileSync(SAMPLE_IFC4, 'latin1').replace("FILE_SCHEMA(('IFC4'))", "FILE_SCHEMA(('IFC9'))"))], /schema/],
    ['bad forces file', () => [SAMPLE_IFC4, '--forces', write('f.csv', 'GlobalId,LoadCase,N [kN]\n0P0uekf7BoiVQdxZeJCu9v,ULS1,lots\n')], /line 2: .*not a number/],
    ['forces for no member', () => [SAMPLE_IFC4, '--forces', write('g.csv', 'Tag,LoadCase,N [kN]\nNOPE-1,ULS1,10\n')], /no member with tag "NOPE-1"/],
    ['unknown option', () => [SAMPLE_IFC4, '--colour', 'red'], /unknown option --colour/],
    ['unknown standard', () => [SAMPLE_IFC4, '--standard', 'bs5950'], /--standard/],
    ['binary format without --out', () => [SAMPLE_IFC4, '--format', 'pdf'], /needs --out/],
    ['time limit exceeded', () => [SAMPLE_IFC4, '--time-limit', '0.02'], /time limit/],
  ];
  let runs: Run[];
  const write = (name: string, text: string) => (writeFileSync(path.join(dir, name), text, 'latin1'), path.join(dir, name));
  beforeAll(async () => {
    runs = await Promise.all(cases.map(([, args]) => gaugeline(args())));
  }, 180_000);

  cases.forEach(([label, , message], i) => {
    it(`${label}: exit 2 and one line on stderr`, () => {
      const r = runs[i];
      expect(r.code, r.err).toBe(2);
      expect(r.out).toBe('');
      expect(r.err.endsWith('\n')).toBe(true);
      expect(r.err.trimEnd().split('\n')).toHaveLength(1);
      expect(r.err).toMatch(message);
    });
  });

  it('the unknown schema case really changed the header', () => {
    expect(readFileSync(SAMPLE_IFC4, 'latin1')).toContain("FILE_SCHEMA(('IFC4'))");
  });
});
