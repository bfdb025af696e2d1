// Forces tables with wrong columns, units, signs, duplicates and unknown members: each is
// refused with a per-row report and nothing half-applied (the revision's stored rows stay
// byte-for-byte the same), even when 999 rows are good and one is bad; the accepted units
// (kN, kip, N) convert to newtons and the sign convention holds. Complements the basic
// cases in members-and-forces.test.ts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startTestApp, type TestApp } from '../support/test-app';
import { signIn, DEMO, type Caller } from '../support/api-client';
import { importEnded, revisionRowsJson, uploadFile } from '../support/imports';
import { FORCE_COLUMNS } from '../../shared/forces/parse-forces-csv';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SAMPLE = readFileSync(path.join(root, 'samples/kestrel-yard-shed.ifc'));

interface Row {
  globalId: string;
  tag: string | null;
  designForceN: number | null;
  forceSource: string | null;
  designCapacityN: number | null;
  utilisation: number | null;
}

let app: TestApp;
let engineer: Caller;
let base: string;
let revisionId: number;
let members: Row[];

const rows = async (): Promise<Row[]> => (await engineer.call('get', `${base}/members?pageSize=500&scope=all`)).body.members;
const stored = () => revisionRowsJson(app.dbName, revisionId);
const post = (csv: string) => engineer.call('post', `${base}/forces`, { csv });

/** Posts a file that must be refused: 422 with the expected problem lines, and nothing stored changes. */
async function expectRejected(csv: string, lines: number[], message?: RegExp) {
  const before = await stored();
  const res = await post(csv);
  expect(res.status, JSON.stringify(res.body)).toBe(422);
  expect(res.body.error).toBe('forces.rejected');
  const problems: { line: number; message: string }[] = res.body.details.problems;
  expect(problems.map((p) => p.line)).toEqual(lines);
  for (const p of problems) expect(p.message.length).toBeGreaterThan(5);
  if (message) expect(problems.map((p) => p.message).join(' | ')).toMatch(message);
  expect(await stored(), 'stored rows changed by a refused file').toBe(before);
  return problems;
}

beforeAll(async () => {
  app = await startTestApp({ IMPORT_POLL_MS: '100' });
  engineer = await signIn(app.url, DEMO.engineer);
  const projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
  const up = await uploadFile(engineer, projectId, SAMPLE, 'kestrel-yard-shed.ifc');
  revisionId = up.body.revision.id;
  const done = await importEnded(engineer, projectId, revisionId);
  expect(done.body.status).toBe('done');
  base = `/api/projects/${projectId}/revisions/${revisionId}`;
  members = await rows();
  expect(members.length).toBeGreaterThan(5);
}, 120_000);

afterAll(async () => {
  await app?.stop();
});

describe('forces tables that are refused whole', () => {
  it('999 good rows and one bad row: a report naming the bad line, and nothing changes', async () => {
    const lines = ['GlobalId,LoadCase,N [kN]'];
    for (let i = 0; lines.length < 1000; i++) lines.push(`${members[i % members.length].globalId},LC${Math.floor(i / members.length)},${(i % 50) + 1}`);
    expect(lines.length - 1).toBe(999);
    lines.splice(500, 0, `${members[0].globalId},LC-bad,not-a-number`);
    const problems = await expectRejected(`${lines.join('\n')}\n`, [501], /not a number/);
    expect(problems).toHaveLength(1);
  });

  it('wrong header: no member column, no load case, no force column, two force columns, an unknown unit', async () => {
    const gid = members[0].globalId;
    await expectRejected(`Member,LoadCase,N [kN]\nx,A,1\n`, [1], /GlobalId/);
    await expectRejected(`GlobalId,N [kN]\n${gid},1\n`, [1], /LoadCase/);
    await expectRejected(`GlobalId,LoadCase\n${gid},A\n`, [1], /force column/);
    await expectRejected(`GlobalId,LoadCase,N [kN],N [kip]\n${gid},A,1,1\n`, [1], /found N \[kN\], N \[kip\]/);
    await expectRejected(`GlobalId,LoadCase,N [lbf]\n${gid},A,1\n`, [1], /N \[kN\]/);
    await expectRejected(`GlobalId,LoadCase,N [kN]\n`, [1], /no rows/);
  });

  it('duplicated member and load case, unknown and malformed GlobalIds, ambiguous or unknown tags', async () => {
    const [a, b] = members;
    await expectRejected(
      [
        'GlobalId,LoadCase,N [kN]',
        `${a.globalId},ULS1,10`,
        `${b.globalId},ULS1,10`,
        `${a.globalId},ULS1,12`, // same member and case as line 2
        `${'Z'.repeat(22)},ULS1,1`, // no such member
        `${a.globalId.slice(0, 21)},ULS1,1`, // 21 characters
        `,ULS1,1`, // no member at all
        `${b.globalId},,1`, // no load case
      ].join('\n'),
      [4, 5, 6, 7, 8],
      /duplicates line 2/,
    );
    await expectRejected(`Tag,LoadCase,N [kN]\nNO-SUCH-TAG,ULS1,1\n`, [2], /NO-SUCH-TAG/);
  });

  it('a decimal comma in a comma-separated file is refused, not read as a smaller force', async () => {
    await expectRejected(`GlobalId,LoadCase,N [kN]\n${members[0].globalId},ULS1,1,5\n`, [2], /more cells than the header/);
  });

  it('a value that is a unit slip (N typed into a kN column) is refused, not applied', async () => {
    await expectRejected(`GlobalId,LoadCase,N [kN]\n${members[0].globalId},ULS1,182000000\n`, [2], /check the unit/);
  });
});

describe('units and signs', () => {
  /** Applies one load case per member and returns the rows afterwards. */
  async function apply(csv: string): Promise<Row[]> {
    const res = await post(csv);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return rows();
  }

  it('N [kip] converts to newtons', async () => {
    const target = members[0];
    const after = await apply(`GlobalId,LoadCase,N [kip]\n${target.globalId},KIP,10\n`);
    const m = after.find((r) => r.globalId === target.globalId)!;
    expect(m.forceSource).toBe('forces-csv');
    expect(m.designForceN).toBeCloseTo(10 * FORCE_COLUMNS['N [kip]'], 6);
    expect(m.designForceN).toBeCloseTo(44482.216, 2);
    if (m.designCapacityN) expect(m.utilisation).toBeCloseTo(m.designForceN! / m.designCapacityN, 9);
  });

  it('N [N], semicolons and decimal commas are read; kN and N of the same force agree', async () => {
    const [a, b] = members;
    const after = await apply(`GlobalId;LoadCase;N [N]\n${a.globalId};NEWTON;12500,5\n${b.globalId};NEWTON;7000\n`);
    expect(after.find((r) => r.globalId === a.globalId)!.designForceN).toBeCloseTo(12500.5, 6);
    const inKn = await apply(`GlobalId,LoadCase,N [kN]\n${b.globalId},KILONEWTON,7\n`);
    expect(inKn.find((r) => r.globalId === b.globalId)!.designForceN).toBeCloseTo(7000, 6);
  });

  it('tension is positive: a member with only compression in the file has no design tension', async () => {
    const target = members[2];
    const after = await apply(`GlobalId,LoadCase,N [kN]\n${target.globalId},C1,-50\n${target.globalId},C2,-75.5\n`);
    const m = after.find((r) => r.globalId === target.globalId)!;
    expect(m.forceSource === null || m.designForceN === null || m.designForceN <= 0, JSON.stringify(m)).toBe(true);
    expect(m.utilisation === null || m.utilisation === 0, JSON.stringify(m)).toBe(true);
    const mixed = await apply(`GlobalId,LoadCase,N [kN]\n${target.globalId},C1,-50\n${target.globalId},T1,20\n`);
    expect(mixed.find((r) => r.globalId === target.globalId)!.designForceN).toBeCloseTo(20_000, 6);
  });
});
