import { describe, expect, it, beforeAll, afterAll } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'gaugeline-cli-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function run(cmd: string, content?: unknown, raw?: string) {
  const file = join(dir, `${Math.random().toString(36).slice(2)}.json`);
  if (content !== undefined || raw !== undefined) writeFileSync(file, raw ?? JSON.stringify(content));
  const r = spawnSync(process.execPath, ['bin/gaugeline.js', cmd, file], { cwd: root, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('gaugeline net-area', () => {
  it('SCI AD 398 Example 1 (design-rules C9): chain B-C-D governs, An = 5000 − 1099.46 mm²', () => {
    const r = run('net-area', { width: 250, thickness: 20, holes: [{ x: 0, y: 50, d: 22 }, { x: 50, y: 130, d: 22 }, { x: 20, y: 200, d: 22 }] });
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    expect(o.grossArea).toBe(5000);
    expect(o.netArea).toBeCloseTo(3900.536, 2);
    expect(o.netWidth).toBeCloseTo(3900.536 / 20, 2);
    expect(o.chain).toEqual([0, 1, 2]);
  });
  it('chain lists input indices in increasing y whatever the input order', () => {
    const r = run('net-area', { width: 250, thickness: 20, holes: [{ x: 20, y: 200, d: 22 }, { x: 0, y: 50, d: 22 }, { x: 50, y: 130, d: 22 }] });
    expect(JSON.parse(r.out).chain).toEqual([1, 2, 0]);
  });
  it('no holes: An = Ag and an empty chain', () => {
    const o = JSON.parse(run('net-area', { width: 100, thickness: 10, holes: [] }).out);
    expect(o).toEqual({ grossArea: 1000, netArea: 1000, netWidth: 100, chain: [] });
  });
});

describe('gaugeline check-member', () => {
  it('EN angle by one leg, one row of 3 bolts: 3.10.3 applied without being told (SBE Part 8 Ex. 3, p1 = 80 mm pair, design-rules C10)', () => {
    const r = run('check-member', { standard: 'en1993', section: { shape: 'angle', legA: 120, legB: 80, thickness: 12, connectedLeg: 'A' }, steel: { fy: 235, fu: 360 }, holes: [0, 80, 160].map((x) => ({ x, y: 70, d: 22 })), force: 300, grossArea: 2270 });
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    expect(Math.abs(o.designCapacity / 341 - 1)).toBeLessThan(0.005);
    expect(o.utilisation).toBeCloseTo(300 / o.designCapacity, 5);
    expect(o.netArea).toBeCloseTo(2006, 6);
    expect(o.modes.map((m: { name: string }) => m.name)).toContain(o.governing);
    expect(o.trace.length).toBeGreaterThan(2);
  });
  it('AS 4100 flat, kN in and out', () => {
    const o = JSON.parse(run('check-member', { standard: 'as4100', section: { shape: 'flat', width: 200, thickness: 10 }, steel: { fy: 300, fu: 440 }, holes: [{ x: 0, y: 100, d: 22 }], force: 100 }).out);
    expect(o.designCapacity).toBeCloseTo((0.9 * Math.min(2000 * 300, 0.85 * (2000 - 220) * 440)) / 1000, 5);
  });
  it('AISC LRFD angle: U is the larger of Case 2 and Case 8 from the hole pattern; the 2 mm allowance is added', () => {
    const o = JSON.parse(run('check-member', { standard: 'aisc360-lrfd', section: { shape: 'angle', legA: 100, legB: 100, thickness: 10, connectedLeg: 'A' }, steel: { grade: 'A36' }, holes: [0, 75, 150, 225].map((x) => ({ x, y: 45, d: 22 })), force: 200 }).out);
    expect(o.netArea).toBeCloseTo(10 * 190 - 24 * 10, 6);
    const U = o.trace.find((s: { symbol: string }) => s.symbol === 'U').value;
    expect(U).toBeGreaterThan(0.8);
    expect(U).toBeLessThan(1);
  });
  it('AISC ASD and an unknown force give utilisation null', () => {
    const o = JSON.parse(run('check-member', { standard: 'aisc360-asd', section: { shape: 'flat', width: 100, thickness: 10 }, steel: { fy: 250, fu: 400 }, holes: [] }).out);
    expect(o.utilisation).toBeNull();
    expect(o.designCapacity).toBeCloseTo((250 * 1000) / 1.67 / 1000, 5);
  });
});

describe('bad input: exit code 2 and one line naming the field', () => {
  const flat = { standard: 'as4100', section: { shape: 'flat', width: 120, thickness: 10 }, steel: { fy: 300, fu: 440 }, holes: [], force: 10 };
  it.each([
    ['hole outside the width', 'net-area', { width: 120, thickness: 10, holes: [{ x: 0, y: 50, d: 22 }, { x: 0, y: 60, d: 22 }, { x: 0, y: 130, d: 22 }] }, /^holes\[2\]\.y: hole centre 130 mm lies outside the 120 mm developed width$/],
    ['negative width', 'net-area', { width: -5, thickness: 10, holes: [] }, /^width: /],
    ['missing thickness', 'net-area', { width: 100, holes: [] }, /^thickness: is required/],
    ['NaN written as a string', 'net-area', { width: 'NaN', thickness: 10, holes: [] }, /^width: must be/],
    ['zero hole diameter', 'net-area', { width: 100, thickness: 10, holes: [{ x: 0, y: 5, d: 0 }] }, /^holes\[0\]\.d: /],
    ['unknown standard', 'check-member', { ...flat, standard: 'bs5950' }, /^standard: must be one of/],
    ['unknown grade', 'check-member', { ...flat, steel: { grade: 'Unobtainium' } }, /^steel\.grade: unknown steel grade/],
    ['angle hole beyond the developed width', 'check-member', { ...flat, section: { shape: 'angle', legA: 100, legB: 75, thickness: 10 }, holes: [{ x: 0, y: 200, d: 22 }] }, /^holes\[0\]\.y: hole centre 200 mm lies outside the 165 mm developed width$/],
    ['negative section dimension', 'check-member', { ...flat, section: { shape: 'flat', width: 120, thickness: -1 } }, /^section\.thickness: /],
  ])('%s', (_name, cmd, content, pattern) => {
    const r = run(cmd as string, content);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err.trim().split('\n')).toHaveLength(1);
    expect(r.err.trim()).toMatch(pattern as RegExp);
  });
  it('bad JSON', () => {
    const r = run('net-area', undefined, '{"width": 10,');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/not valid JSON/);
  });
  it('missing file', () => {
    const r = spawnSync(process.execPath, ['bin/gaugeline.js', 'net-area', join(dir, 'nope.json')], { cwd: root, encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/no such file/);
  });
  it('unknown command', () => {
    const r = spawnSync(process.execPath, ['bin/gaugeline.js', 'frobnicate'], { cwd: root, encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
