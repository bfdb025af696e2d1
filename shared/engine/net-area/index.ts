export * from './types.ts';
export { DEFAULT_Y_TOLERANCE, prepareStrip, type PreparedStrip } from './prepare.ts';
export { longestChain, type BestChain } from './longest-path.ts';
export { bestStraightSection } from './straight-sections.ts';
export { rankedChains } from './ranked-chains.ts';
export { solveNetArea, minNetArea, chainDeduction } from './solve.ts';
