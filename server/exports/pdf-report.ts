/**
 * Calculation report (A4 PDF): a cover with the project, revision, standard, engine and
 * the cautions; a summary table of every exported member; then one section per member
 * (pdf-member.ts). Every page carries a footer with the short caution and page number.
 */
import PDFDocument from 'pdfkit';
import { CAUTIONS, CAUTION_SUMMARY } from '@shared/api/cautions';
import { BAND_STYLE, RESULT_BANDS } from '@shared/api/results';
import { EXPORT_UNITS, kN, type ExportBundle } from './export-bundle';
import { factorSettings, fixed, standardLine } from './export-text';
import { registerFonts, write, widthOf } from './pdf-fonts';
import { writeMember } from './pdf-member';
import { CONTENT_WIDTH, INK, MUTED, PAGE, RULE } from './pdf-style';

const BAND_WORDS: Record<string, string> = {
  spare: 'U < 0.60',
  working: '0.60 ≤ U < 0.85',
  tight: '0.85 ≤ U ≤ 1.00',
  over: 'U > 1.00',
  unknown: 'no design force or missing input',
};

function cover(doc: PDFKit.PDFDocument, b: ExportBundle): void {
  const x = PAGE.margin;
  doc.fillColor(INK).fontSize(20);
  write(doc, 'Tension member calculation report', { x, y: PAGE.margin + 20, weight: 'bold' });
  doc.moveDown(0.8).fontSize(11);
  const facts: [string, string][] = [
    ['Project', b.project.name],
    ['Model', `${b.model.name} — revision ${b.revision.number} (${b.revision.fileName})`],
    ['Standard', standardLine(b)],
    ['Checked', b.revision.checkedAt],
    ['Report made', b.generatedAt],
    ['Engine version', b.engineVersion],
    ['Members', `${b.members.length} (${b.filterDescription})`],
    ['Units', `forces ${EXPORT_UNITS.force}, areas ${EXPORT_UNITS.area}, lengths ${EXPORT_UNITS.length}, stresses ${EXPORT_UNITS.stress}; utilisation U = design force / design capacity`],
  ];
  const factors = factorSettings(b);
  if (factors.length) facts.push(['Factors', factors.map((f) => `${f.name} = ${f.value}`).join(', ')]);
  for (const [k, v] of facts) {
    doc.fillColor(MUTED).fontSize(9);
    write(doc, k, { x, width: CONTENT_WIDTH });
    doc.fillColor(INK).fontSize(11);
    write(doc, v, { x, width: CONTENT_WIDTH });
    doc.moveDown(0.3);
  }
  doc.moveDown(1).fillColor(INK).fontSize(12);
  write(doc, 'Cautions', { x, weight: 'bold' });
  doc.fontSize(9.5).moveDown(0.3);
  for (const c of CAUTIONS) {
    write(doc, `• ${c}`, { x, width: CONTENT_WIDTH });
    doc.moveDown(0.25);
  }
  doc.moveDown(0.8).fontSize(9).fillColor(MUTED);
  write(doc, `Bands: ${RESULT_BANDS.map((band) => `${BAND_STYLE[band].label} (${BAND_WORDS[band]})`).join('; ')}.`, { x, width: CONTENT_WIDTH });
}

const COLS: { title: string; width: number; align?: 'right' }[] = [
  { title: 'Member', width: 150 },
  { title: 'Profile', width: 80 },
  { title: 'Force [kN]', width: 50, align: 'right' },
  { title: 'Capacity [kN]', width: 58, align: 'right' },
  { title: 'U', width: 32, align: 'right' },
  { title: 'Band', width: 44 },
  { title: 'Governing', width: CONTENT_WIDTH - 414 },
];

/** Left edge of the band column, where the colour swatch sits. */
const BAND_X = COLS.slice(0, 5).reduce((a, c) => a + c.width, 0);

function tableRow(doc: PDFKit.PDFDocument, cells: string[], y: number, bold = false): void {
  let x = PAGE.margin;
  cells.forEach((text, i) => {
    const c = COLS[i];
    let t = text;
    // Cut long cells instead of wrapping, so rows stay one line high.
    while (t.length > 1 && widthOf(doc, t, bold ? 'bold' : 'regular') > c.width - 4) t = t.slice(0, -2) + '…';
    const dx = c.align === 'right' ? c.width - 4 - widthOf(doc, t, bold ? 'bold' : 'regular') : 0;
    write(doc, t, { x: x + dx, y, lineBreak: false, weight: bold ? 'bold' : 'regular' });
    x += c.width;
  });
}

function summary(doc: PDFKit.PDFDocument, b: ExportBundle): void {
  doc.addPage();
  doc.fillColor(INK).fontSize(13);
  write(doc, 'Summary', { x: PAGE.margin, y: PAGE.margin, weight: 'bold' });
  let y = doc.y + 6;
  const header = () => {
    doc.fontSize(8).fillColor(INK);
    tableRow(doc, COLS.map((c) => c.title), y, true);
    y += 13;
    doc.moveTo(PAGE.margin, y - 2).lineTo(PAGE.margin + CONTENT_WIDTH, y - 2).lineWidth(0.5).strokeColor(RULE).stroke();
  };
  header();
  for (const m of b.members) {
    if (y > PAGE.height - PAGE.margin - 14) {
      doc.addPage();
      y = PAGE.margin;
      header();
    }
    const band = BAND_STYLE[m.row.band];
    doc.rect(PAGE.margin + BAND_X, y + 1, 7, 7).fill(band.colour);
    doc.fontSize(8).fillColor(INK);
    const label = m.row.tag ? `${m.row.tag} ${m.row.name ?? ''}`.trim() : (m.row.name ?? m.row.globalId);
    tableRow(doc, [label, m.row.profile ?? '', fixed(kN(m.row.designForceN), 1), fixed(kN(m.row.designCapacityN), 1), fixed(m.row.utilisation, 2), `   ${band.label}`, m.row.governing ?? ''], y);
    y += 12;
  }
}

/** Footer on every page: who made it, the short caution, page n of N. */
function footers(doc: PDFKit.PDFDocument, b: ExportBundle): void {
  const range = doc.bufferedPageRange();
  const standard = standardLine(b); // once: it scans every member's assumptions
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0; // writing inside the margin must not start a new page
    doc.fontSize(6.5).fillColor(MUTED);
    write(doc, `${b.project.name} · revision ${b.revision.number} · ${standard} · engine ${b.engineVersion} · page ${i + 1} of ${range.count}`, { x: PAGE.margin, y: PAGE.height - 34, width: CONTENT_WIDTH, lineBreak: false });
    write(doc, CAUTION_SUMMARY, { x: PAGE.margin, y: PAGE.height - 25, width: CONTENT_WIDTH, lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
}

export function writePdfReport(bundle: ExportBundle): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: PAGE.margin,
    bufferPages: true,
    info: { Title: `Tension member calculations — ${bundle.project.name}, revision ${bundle.revision.number}`, Creator: `Gaugeline ${bundle.engineVersion}`, CreationDate: new Date(bundle.generatedAt) },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerFonts(doc);
  cover(doc, bundle);
  summary(doc, bundle);
  for (const m of bundle.members) writeMember(doc, m);
  footers(doc, bundle);
  doc.end();
  return done;
}
