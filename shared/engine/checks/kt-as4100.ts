import type { Section } from '../section-types.ts';
import type { ConnectedElements } from '../sections/eccentricity.ts';

/**
 * AS 4100 Cl. 7.3 correction factor kt for the distribution of forces (Table 7.3.2;
 * all values from memory — verify against the purchased standard). Dimensionless.
 */
export function ktAs4100(s: Section, connected: ConnectedElements): { kt: number; basis: string; judgement: boolean } {
  if (connected === 'all' || s.shape === 'flat' || s.shape === 'round-bar' || s.shape === 'chs' || s.shape === 'rhs') {
    return { kt: 1.0, basis: 'Cl. 7.3.1: force transmitted to every element (uniform distribution)', judgement: false };
  }
  if (s.shape === 'angle') {
    const own = connected === 'leg B' ? s.legB : s.legA;
    const other = connected === 'leg B' ? s.legA : s.legB;
    if (own < other) return { kt: 0.75, basis: 'Table 7.3.2: unequal angle connected by the short leg (from memory)', judgement: false };
    return { kt: 0.85, basis: 'Table 7.3.2: equal angle, or unequal angle connected by the long leg (from memory)', judgement: false };
  }
  if (s.shape === 'channel' && connected === 'web') return { kt: 0.85, basis: 'Table 7.3.2: channel connected by the web only (from memory)', judgement: false };
  if (s.shape === 'tee' && (connected === 'flange' || connected === 'flanges')) return { kt: 0.9, basis: 'Table 7.3.2: tee connected by the flange only (from memory, low confidence)', judgement: false };
  if ((s.shape === 'i' || s.shape === 'channel') && connected === 'flanges') {
    return { kt: 0.85, basis: 'Cl. 7.3.2(b): I-section or channel connected by both flanges only, conditions (i) and (ii) assumed met (from memory)', judgement: true };
  }
  return { kt: 0.75, basis: 'no listed case: 0.75 taken as a conservative default (judgement)', judgement: true };
}
