/**
 * Workbook export: "Members" (one row per member, typed numbers with fixed decimals, the
 * band as a coloured cell with its word), "Assumptions" (settings and every assumed value
 * per member) and "About" (project, revision, dates, engine, units, filter, cautions).
 * Numbers stay numbers so engineers can sort and sum; formats only change how they show.
 */
import ExcelJS from 'exceljs';
import { CAUTIONS } from '@shared/api/cautions';
import { BAND_STYLE } from '@shared/api/results';
import { EXPORT_UNITS, kN, type ExportBundle } from './export-bundle';
import { assumedValues, editionOf, factorSettings, standardLabel } from './export-text';

const HEADER_FILL = 'FF2B3A42';

/** Black or white text, whichever reads better on the band colour. */
function textOn(hex: string): string {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b > 0.5 ? 'FF000000' : 'FFFFFFFF';
}

function styleHeader(ws: ExcelJS.Worksheet): void {
  const row = ws.getRow(1);
  row.font = { bold: true, color: { argb: 'FFFFFFFF' } };
  row.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: HEADER_FILL } };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
}

function membersSheet(wb: ExcelJS.Workbook, bundle: ExportBundle): void {
  const ws = wb.addWorksheet('Members');
  ws.columns = [
    { header: 'GlobalId', key: 'globalId', width: 25 },
    { header: 'Tag', key: 'tag', width: 12 },
    { header: 'Name', key: 'name', width: 28 },
    { header: 'IFC class', key: 'ifcClass', width: 14 },
    { header: 'Profile', key: 'profile', width: 16 },
    { header: 'Grade', key: 'grade', width: 20 },
    { header: 'Holes', key: 'holes', width: 7, style: { numFmt: '0' } },
    { header: `Design force [${EXPORT_UNITS.force}]`, key: 'force', width: 15, style: { numFmt: '0.0' } },
    { header: `Design capacity [${EXPORT_UNITS.force}]`, key: 'capacity', width: 17, style: { numFmt: '0.0' } },
    { header: 'Utilisation [-]', key: 'utilisation', width: 13, style: { numFmt: '0.00' } },
    { header: 'Band', key: 'band', width: 11 },
    { header: 'Governing mode', key: 'governing', width: 22 },
    { header: `Gross area [${EXPORT_UNITS.area}]`, key: 'gross', width: 15, style: { numFmt: '0' } },
    { header: `Net area [${EXPORT_UNITS.area}]`, key: 'net', width: 14, style: { numFmt: '0' } },
    { header: 'Force source', key: 'forceSource', width: 14 },
    { header: 'Warnings', key: 'warnings', width: 60 },
  ];
  for (const m of bundle.members) {
    const row = ws.addRow({
      globalId: m.row.globalId,
      tag: m.row.tag,
      name: m.row.name,
      ifcClass: m.row.ifcClass,
      profile: m.row.profile,
      grade: m.row.grade,
      holes: m.row.holeCount,
      force: kN(m.row.designForceN),
      capacity: kN(m.row.designCapacityN),
      utilisation: m.row.utilisation,
      band: BAND_STYLE[m.row.band].label,
      governing: m.row.governing,
      gross: m.result?.grossArea ?? null,
      net: m.row.netAreaMm2,
      forceSource: m.row.forceSource,
      warnings: m.row.warnings.join('\n'),
    });
    const colour = BAND_STYLE[m.row.band].colour;
    const band = row.getCell('band');
    band.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: `FF${colour.slice(1).toUpperCase()}` } };
    band.font = { color: { argb: textOn(colour) } };
  }
  styleHeader(ws);
  ws.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: ws.columns.length } };
}

function assumptionsSheet(wb: ExcelJS.Workbook, bundle: ExportBundle): void {
  const ws = wb.addWorksheet('Assumptions');
  ws.columns = [
    { header: 'GlobalId', key: 'globalId', width: 25 },
    { header: 'Member', key: 'member', width: 24 },
    { header: 'Assumed value', key: 'name', width: 24 },
    { header: 'Value', key: 'value', width: 18 },
    { header: 'Source', key: 'source', width: 80 },
  ];
  // Settings first: they apply to every member below.
  const setting = (name: string, value: string | number, source: string) => ws.addRow({ globalId: '(all members)', member: 'setting', name, value, source });
  setting('standard', standardLabel(bundle.revision.standard), 'project setting');
  setting('edition', editionOf(bundle), 'engine');
  for (const f of factorSettings(bundle)) setting(f.name, f.value, f.source);
  for (const m of bundle.members) {
    for (const a of assumedValues(m)) ws.addRow({ globalId: m.row.globalId, member: m.row.tag ?? m.row.name ?? '', name: a.name, value: a.value, source: a.source });
  }
  styleHeader(ws);
}

function aboutSheet(wb: ExcelJS.Workbook, bundle: ExportBundle): void {
  const ws = wb.addWorksheet('About');
  ws.columns = [{ header: 'Item', key: 'k', width: 22 }, { header: 'Value', key: 'v', width: 110 }];
  const rows: [string, string | number][] = [
    ['Project', bundle.project.name],
    ['Model', bundle.model.name],
    ['Revision', bundle.revision.number],
    ['File', bundle.revision.fileName],
    ['Standard', standardLabel(bundle.revision.standard)],
    ['Edition', editionOf(bundle)],
    ['Checked at', bundle.revision.checkedAt],
    ['Exported at', bundle.generatedAt],
    ['Engine version', bundle.engineVersion],
    ['Members', bundle.members.length],
    ['Filter', bundle.filterDescription],
    ['Units', `forces ${EXPORT_UNITS.force}, areas ${EXPORT_UNITS.area}, lengths ${EXPORT_UNITS.length}, stresses ${EXPORT_UNITS.stress}; utilisation = ${EXPORT_UNITS.utilisation}`],
    ...CAUTIONS.map((c, i): [string, string] => [i === 0 ? 'Cautions' : '', c]),
  ];
  for (const [k, v] of rows) ws.addRow({ k, v }).getCell('v').alignment = { wrapText: true, vertical: 'top' };
  styleHeader(ws);
}

export async function writeXlsx(bundle: ExportBundle): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = `Gaugeline ${bundle.engineVersion}`;
  wb.created = new Date(bundle.generatedAt);
  membersSheet(wb, bundle);
  assumptionsSheet(wb, bundle);
  aboutSheet(wb, bundle);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
