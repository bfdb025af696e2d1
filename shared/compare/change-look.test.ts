import { describe, expect, it } from 'vitest';
import { CHANGE_KINDS, type ChangeKind } from './compare-revisions';
import { CHANGE_PRECEDENCE, CHANGE_STYLE, changeLookOf } from './change-look';

// Colour arithmetic for the palette checks: sRGB → linear → CIE Lab (D65).
const linear = (v: number) => (v / 255 <= 0.04045 ? v / 255 / 12.92 : ((v / 255 + 0.055) / 1.055) ** 2.4);
const rgbOf = (hex: string) => {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255].map(linear);
};
function labOf([r, g, b]: number[]): number[] {
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : ((24389 / 27) * t + 16) / 116);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}
// Full-severity colour-vision-deficiency simulation matrices on linear RGB (Machado, Oliveira
// and Fernandes 2009, severity 1.0; values from memory of the published table).
const SIMULATIONS: Record<string, number[][]> = {
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  tritanopia: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.3039],
  ],
};
const simulate = (rgb: number[], m: number[][]) => m.map((row) => Math.min(1, Math.max(0, row[0] * rgb[0] + row[1] * rgb[1] + row[2] * rgb[2])));
const deltaE = (a: number[], b: number[]) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);

describe('changeLookOf', () => {
  it('gives every kind of change a look, and every drawn kind a colour of its own', () => {
    for (const kind of CHANGE_KINDS) {
      const look = changeLookOf([kind]);
      if (kind === 'removed') expect(look).toEqual({ kind: 'removed' });
      else expect(look).toMatchObject({ kind: 'drawn', shownAs: kind, colour: CHANGE_STYLE[kind].colour });
    }
    expect([...CHANGE_PRECEDENCE, 'removed'].sort()).toEqual([...CHANGE_KINDS].sort());
    expect(new Set(Object.values(CHANGE_STYLE).map((s) => s.colour.toUpperCase())).size).toBe(CHANGE_PRECEDENCE.length);
  });

  it('shows the most urgent of several changes, whatever their order', () => {
    expect(changeLookOf(['force-changed', 'utilisation-up', 'newly-critical'])).toMatchObject({ shownAs: 'newly-critical', outlined: true });
    expect(changeLookOf(['newly-critical', 'added'])).toMatchObject({ shownAs: 'newly-critical' });
    expect(changeLookOf(['utilisation-down', 'resized'])).toMatchObject({ shownAs: 'resized', outlined: false });
    expect(changeLookOf(['rebolted', 'regraded', 'force-changed'])).toMatchObject({ shownAs: 'regraded' });
    expect(changeLookOf(['utilisation-up', 'added'])).toMatchObject({ shownAs: 'utilisation-up' });
    expect(changeLookOf(['force-changed', 'utilisation-down'])).toMatchObject({ shownAs: 'force-changed' });
    // Every pair follows the list: the earlier kind wins in both orders.
    CHANGE_PRECEDENCE.forEach((first, i) =>
      CHANGE_PRECEDENCE.slice(i + 1).forEach((later) => {
        expect(changeLookOf([first, later])).toMatchObject({ shownAs: first });
        expect(changeLookOf([later, first])).toMatchObject({ shownAs: first });
      }),
    );
  });

  it('treats taken-out members as not drawable and no change as unchanged', () => {
    expect(changeLookOf(['removed'])).toEqual({ kind: 'removed' });
    expect(changeLookOf(['resized', 'removed'] as ChangeKind[])).toEqual({ kind: 'removed' });
    expect(changeLookOf([])).toEqual({ kind: 'unchanged' });
  });

  it('outlines only the most urgent kind', () => {
    expect(CHANGE_PRECEDENCE.filter((k) => CHANGE_STYLE[k].outlined)).toEqual(['newly-critical']);
  });
});

describe('the change palette', () => {
  it('reads in grey print: lightness falls with urgency, at least 6 L* a step', () => {
    const lightness = CHANGE_PRECEDENCE.map((k) => labOf(rgbOf(CHANGE_STYLE[k].colour))[0]);
    for (let i = 1; i < lightness.length; i++) expect(lightness[i] - lightness[i - 1], `${CHANGE_PRECEDENCE[i - 1]} → ${CHANGE_PRECEDENCE[i]}`).toBeGreaterThanOrEqual(6);
  });

  it('keeps every two colours apart for red–green and blue–yellow colour blindness (ΔE*ab ≥ 12 simulated)', () => {
    for (const [name, matrix] of Object.entries(SIMULATIONS)) {
      const labs = CHANGE_PRECEDENCE.map((k) => labOf(simulate(rgbOf(CHANGE_STYLE[k].colour), matrix)));
      labs.forEach((a, i) => labs.slice(i + 1).forEach((b, j) => expect(deltaE(a, b), `${name}: ${CHANGE_PRECEDENCE[i]} / ${CHANGE_PRECEDENCE[i + j + 1]}`).toBeGreaterThanOrEqual(12)));
    }
  });
});
