export { identifyGrade, steelFromGrade, resolveSteel, type Steel, type SteelOptions } from './parse-grade.ts';
export { AS3678, AS3679, ASTM, EN10025, EN1993_TABLE_3_1, bandFor, type Band, type GradeTable } from './grade-tables.ts';
