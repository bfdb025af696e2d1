export { holeSize, deductedWidth, type HoleSize, type HoleStandard, type HoleType } from './hole-size.ts';
