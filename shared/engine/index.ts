/** Public API of the tension-capacity engine. Pure: SI units (N, mm, MPa), tension positive. */
export type { Section, SectionShape } from './section-types.ts';
export * from './net-area/index.ts';
export * from './sections/index.ts';
export * from './holes/index.ts';
export * from './materials/index.ts';
export * from './checks/index.ts';
export * from './schemas.ts';
export * from './units.ts';
