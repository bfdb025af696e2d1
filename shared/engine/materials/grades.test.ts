import { describe, expect, it } from 'vitest';
import { identifyGrade, resolveSteel, steelFromGrade } from './index.ts';

// Values: design-rules §7 (tables from memory; AS 4100 Table 2.1, EN 10025-2, EN 1993-1-1 Table 3.1, ASTM).
describe('steel grades', () => {
  it.each([
    ['S355JR', 'S355'], ['STEEL/S235JR', 'S235'], ['S275J2', 'S275'], ['S355J2+N', 'S355'],
    ['ASTM A36', 'ASTM A36'], ['A992', 'ASTM A992'], ['Gr50', 'ASTM A572 Gr 50'], ['A572 Grade 50', 'ASTM A572 Gr 50'],
    ['Grade 300', 'AS/NZS 3679.1-300'], ['300PLUS', 'AS/NZS 3679.1-300'], ['AS/NZS 3679.1-300', 'AS/NZS 3679.1-300'],
    ['AS/NZS 3678-350', 'AS/NZS 3678-350'], ['G250', 'AS/NZS 3678-250'],
  ])('parses %s as %s', (text, grade) => {
    expect(identifyGrade(text)?.grade).toBe(grade);
  });

  it('rejects unknown names', () => {
    expect(identifyGrade('timber')).toBeNull();
    expect(() => steelFromGrade('X99', 10)).toThrow(/unknown steel grade/);
  });

  it('thickness bands', () => {
    expect(steelFromGrade('S355', 16)).toMatchObject({ fy: 355, fu: 470 });
    expect(steelFromGrade('S355', 20)).toMatchObject({ fy: 345, fu: 470 });
    expect(steelFromGrade('S355', 20, { enSource: 'table-3.1' })).toMatchObject({ fy: 355, fu: 510 });
    expect(steelFromGrade('S355', 50, { enSource: 'table-3.1' })).toMatchObject({ fy: 335, fu: 470 });
    expect(steelFromGrade('Grade 300', 10)).toMatchObject({ fy: 320, fu: 440 });
    expect(steelFromGrade('Grade 300', 11)).toMatchObject({ fy: 300 });
    expect(steelFromGrade('Grade 300', 17)).toMatchObject({ fy: 300 });
    expect(steelFromGrade('Grade 300', 18)).toMatchObject({ fy: 280 });
    expect(steelFromGrade('Grade 300', 10, { product: 'plate' })).toMatchObject({ fy: 310, fu: 430 });
    expect(steelFromGrade('AS/NZS 3678-350', 8)).toMatchObject({ fy: 360, fu: 450 });
  });

  it('explicit fy/fu override the grade, each on its own', () => {
    expect(resolveSteel({ grade: 'S355', fu: 490 }, 10)).toMatchObject({ fy: 355, fu: 490 });
    expect(resolveSteel({ fy: 300, fu: 440 }, 10)).toMatchObject({ fy: 300, fu: 440, grade: 'user' });
    expect(() => resolveSteel({ fy: 300 }, 10)).toThrow();
  });
});
