import { describe, expect, it } from 'vitest';
import { parseForcesCsv, tensionEnvelope } from './parse-forces-csv';

const G1 = '0aBcDeFgHiJkLmNoPqRsT1';
const G2 = '0aBcDeFgHiJkLmNoPqRsT2';

describe('parseForcesCsv', () => {
  it('reads kN, kip and N columns into newtons, tension positive', () => {
    const kn = parseForcesCsv(`GlobalId,LoadCase,N [kN],Comment\n${G1},ULS-1,125.5,x\n${G1},ULS-2,-40,\n`);
    expect(kn.problems).toEqual([]);
    expect(kn.rows.map((r) => r.axialN)).toEqual([125500, -40000]);
    // 1 kip = 4.4482216152605 kN (exact by definition of the pound-force).
    const kip = parseForcesCsv(`Tag;LoadCase;N [kip]\nB12;LC1;10\n`);
    expect(kip.rows[0]).toMatchObject({ tag: 'B12', globalId: null, axialN: 44482.216152605 });
    const n = parseForcesCsv(`GlobalId\tLoadCase\tN [N]\n${G2}\tA\t5000\n`);
    expect(n.rows[0].axialN).toBe(5000);
  });

  it('names every missing column in one message', () => {
    const res = parseForcesCsv('Member,Case,Force\nA,B,1\n');
    expect(res.rows).toEqual([]);
    expect(res.problems[0].message).toMatch(/GlobalId.*LoadCase.*N \[kN\]/s);
  });

  it('reports bad rows by line and keeps good ones for the caller to judge', () => {
    const res = parseForcesCsv(`GlobalId,LoadCase,N [kN]\n${G1},A,12\nnot-a-guid,A,3\n${G2},,4\n${G2},A,abc\n${G1},A,13\n${G2},B,5e9\n`);
    expect(res.rows).toHaveLength(1);
    expect(res.problems.map((p) => p.line)).toEqual([3, 4, 5, 6, 7]);
    expect(res.problems[3].message).toMatch(/duplicates line 2/);
    expect(res.problems[4].message).toMatch(/unit/);
  });

  it('takes the largest tension as the envelope and ignores compression', () => {
    expect(tensionEnvelope([{ loadCase: 'a', axialN: -100 }, { loadCase: 'b', axialN: 30 }, { loadCase: 'c', axialN: 20 }])).toEqual({ loadCase: 'b', axialN: 30 });
    expect(tensionEnvelope([{ loadCase: 'a', axialN: -100 }])).toBeNull();
  });
});
