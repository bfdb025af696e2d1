// The member columns of the 3D view: rows survive the trip through JSON unchanged (numbers
// exactly, nulls as nulls), repeated texts are stored once, and malformed columns are refused.
import { describe, expect, it } from 'vitest';
import { decodeMemberColumns, encodeMemberColumns, memberColumnsSchema, MemberColumnsError } from './member-columns';
import type { MemberRow } from './members';

const row = (i: number, over: Partial<MemberRow> = {}): MemberRow => ({
  globalId: `0${String(i).padStart(21, 'A')}`,
  tag: `BR-${i}`,
  name: i % 3 ? `Brace ${i}` : null,
  ifcClass: i % 4 ? 'IfcMember' : 'IfcPlate',
  storey: i % 2 ? 'Level 1' : 'Roof',
  assembly: null,
  profile: 'EA75x75x6',
  grade: 'S355',
  lengthMm: 5000 + i / 7,
  isTension: i % 5 !== 0,
  inclusion: i % 11 ? 'auto' : 'excluded',
  holeCount: 4,
  designForceN: i % 6 ? 123456.789 + i : null,
  forceSource: 'table',
  netAreaMm2: 739.4,
  designCapacityN: 254000.12345678,
  utilisation: i % 6 ? (123456.789 + i) / 254000.12345678 : null,
  governing: i % 2 ? 'member-fracture' : 'block-shear',
  band: 'working',
  warningCount: i % 3,
  ...over,
});

describe('member columns', () => {
  it('give back the same rows after JSON, in the same order', () => {
    const rows = Array.from({ length: 40 }, (_, i) => row(i));
    rows.push(row(99, { utilisation: 1.0000000000000002, band: 'over', storey: null, tag: null, designCapacityN: 0 }));
    const wire = JSON.parse(JSON.stringify(encodeMemberColumns(rows)));
    const decoded = decodeMemberColumns(memberColumnsSchema.parse(wire));
    expect(decoded).toEqual(rows);
    expect(decoded[40].utilisation).toBe(1.0000000000000002);
    expect(decoded[40].storey).toBeNull();
  });

  it('store each repeated text once and are much smaller than an array of rows', () => {
    const rows = Array.from({ length: 2000 }, (_, i) => row(i));
    const cols = encodeMemberColumns(rows);
    expect(cols.texts.filter((t) => t === 'EA75x75x6')).toHaveLength(1);
    expect(cols.texts.filter((t) => t === 'Level 1')).toHaveLength(1);
    expect(JSON.stringify(cols).length).toBeLessThan(JSON.stringify(rows).length * 0.6);
  });

  it('handle a revision without members', () => {
    expect(decodeMemberColumns(encodeMemberColumns([]))).toEqual([]);
  });

  it('refuse columns of unequal length, indexes outside the texts and unknown values', () => {
    const good = () => encodeMemberColumns([row(1), row(2)]);
    const short = good();
    short.utilisation = [0.5];
    expect(() => decodeMemberColumns(short)).toThrow(MemberColumnsError);
    const outside = good();
    outside.profile = [0, outside.texts.length];
    expect(() => decodeMemberColumns(outside)).toThrow(/outside the texts/);
    const badInclusion = good();
    badInclusion.texts.push('sometimes');
    badInclusion.inclusion = [badInclusion.texts.length - 1, badInclusion.inclusion[1]];
    expect(() => decodeMemberColumns(badInclusion)).toThrow(/inclusion/);
    const noBand = good();
    noBand.band = [-1, noBand.band[1]];
    expect(() => decodeMemberColumns(noBand)).toThrow(/band/);
    expect(memberColumnsSchema.safeParse({ ...good(), isTension: [2, 0] }).success).toBe(false);
  });
});
