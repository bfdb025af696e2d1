export { parseSectionName } from './section-names.ts';
export { rolledSection, ROLLED_FAMILIES } from './rolled-sections.ts';
