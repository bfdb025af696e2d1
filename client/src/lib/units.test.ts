import { describe, expect, it } from 'vitest';
import { formatUtilisation, measure, quantityOfUnit, unitsFor } from './units';

describe('units of display', () => {
  it('shows SI with fixed decimals per quantity', () => {
    expect(measure('si', 'force', 96_400).text).toBe('96.4 kN');
    expect(measure('si', 'length', 40).text).toBe('40 mm');
    expect(measure('si', 'area', 661.36).text).toBe('661 mm²');
    expect(measure('si', 'stress', 355).text).toBe('355 MPa');
    expect(measure('si', 'force', 1_234_567).text).toBe('1,234.6 kN');
  });

  it('converts to US customary', () => {
    expect(measure('us', 'force', 4448.2216152605).text).toBe('1.0 kip');
    expect(measure('us', 'length', 25.4).text).toBe('1.00 in');
    expect(measure('us', 'area', 645.16).text).toBe('1.00 in²');
    expect(measure('us', 'stress', 344.7378647).text).toBe('50.0 ksi');
  });

  it('turns typed values back into N, mm and MPa', () => {
    const us = unitsFor('us');
    expect(us.toSI('force', 10)).toBeCloseTo(44_482.216, 2);
    expect(us.toSI('stress', 50)).toBeCloseTo(344.738, 3);
    expect(unitsFor('si').toSI('force', 96.4)).toBeCloseTo(96_400, 6);
  });

  it('formats utilisation to two decimals and never shows -0', () => {
    expect(formatUtilisation(0.8123)).toBe('0.81');
    expect(formatUtilisation(1)).toBe('1.00');
    expect(measure('si', 'force', -10).text).toBe('0.0 kN');
  });

  it('knows the engine units it converts', () => {
    expect(quantityOfUnit('N')).toBe('force');
    expect(quantityOfUnit('mm²')).toBe('area');
    expect(quantityOfUnit('')).toBeNull();
  });
});
