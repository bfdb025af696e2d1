/**
 * One member of the calculation report, read like a hand calculation: what it is, the
 * verdict, the drawing of each bolted end, every step with its clause, the modes, then
 * the assumed values and warnings.
 */
import { BAND_STYLE } from '@shared/api/results';
import type { MemberEndDetail } from '@shared/api/member-detail';
import { kN, memberLabel, type ExportMember } from './export-bundle';
import { assumedValues, fixed } from './export-text';
import { drawEnd } from './pdf-end-drawing';
import { write } from './pdf-fonts';
import { CONTENT_WIDTH, INK, MUTED, PAGE } from './pdf-style';

const DRAWING_HEIGHT = 120;

/** Index of the end whose holes the governing result was computed with, or -1. */
export function governingEndIndex(m: ExportMember): number {
  const input = m.detail.checkInput as { holes?: { x: number; y: number }[] } | null;
  const same = (e: MemberEndDetail) =>
    !!input?.holes && input.holes.length === e.holes.length && e.holes.every((h, i) => h.x === input.holes![i].x && h.y === input.holes![i].y);
  const byInput = m.detail.ends.findIndex(same);
  if (byInput >= 0) return byInput;
  return m.detail.ends.findIndex((e) => e.designCapacity != null && e.designCapacity === m.result?.designCapacity);
}

/** Starts a new page when fewer than `need` points are left. */
function room(doc: PDFKit.PDFDocument, need: number): void {
  if (doc.y + need > PAGE.height - PAGE.margin) doc.addPage();
}

function heading(doc: PDFKit.PDFDocument, text: string): void {
  room(doc, 40);
  doc.moveDown(0.6).fillColor(INK).fontSize(10.5);
  write(doc, text, { x: PAGE.margin, weight: 'bold' });
  doc.moveDown(0.2).fontSize(8.5);
}

/** Trace values: forces in kN (1 decimal), others with trailing zeros dropped. */
function num(v: number, unit: string): string {
  if (unit === 'N') return `${fixed(v / 1000, 1)} kN`;
  const s = Math.abs(v) >= 100 ? v.toFixed(1) : v.toFixed(3);
  const plain = s.replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
  return unit ? `${plain} ${unit}` : plain;
}

function verdict(m: ExportMember): string {
  const cap = kN(m.row.designCapacityN);
  const force = kN(m.row.designForceN);
  if (cap == null) return 'Not checked: the section or an input could not be understood (see warnings).';
  if (force == null) return `Design capacity ${fixed(cap, 1)} kN. No design force is known, so no utilisation is given.`;
  const u = m.row.utilisation ?? force / cap;
  const sign = force <= cap ? '≥' : '<';
  return `Design capacity ${fixed(cap, 1)} kN ${sign} design force ${fixed(force, 1)} kN: utilisation ${fixed(u, 2)} (${BAND_STYLE[m.row.band].label}), governed by ${m.row.governing ?? '—'}.`;
}

export function writeMember(doc: PDFKit.PDFDocument, m: ExportMember): void {
  doc.addPage();
  doc.fillColor(INK).fontSize(13);
  write(doc, memberLabel(m.row), { x: PAGE.margin, y: PAGE.margin, weight: 'bold' });
  doc.fontSize(8.5).fillColor(MUTED);
  const steel = m.detail.steel;
  write(doc, `GlobalId ${m.row.globalId} · ${m.row.ifcClass} · ${m.row.profile ?? 'no profile'} · ${m.row.grade ?? 'no grade'}${steel ? ` (fy ${steel.fy} MPa, fu ${steel.fu} MPa)` : ''} · ${m.row.holeCount} hole(s)${m.row.storey ? ` · ${m.row.storey}` : ''}`, { width: CONTENT_WIDTH });
  doc.moveDown(0.4).fillColor(INK).fontSize(10);
  write(doc, verdict(m), { width: CONTENT_WIDTH, weight: 'bold' });

  const section = m.detail.profile.section;
  const ends = m.detail.ends.filter((e) => e.holes.length);
  if (section && ends.length) {
    heading(doc, 'Bolted ends on the developed section');
    const gov = governingEndIndex(m);
    for (const e of ends) {
      const isGov = m.detail.ends.indexOf(e) === gov;
      room(doc, DRAWING_HEIGHT + 24);
      doc.fontSize(8).fillColor(MUTED);
      const chainHoles = isGov ? (m.result?.net.governing?.holes ?? null) : null;
      const chainText = chainHoles?.length ? `; governing chain through holes ${chainHoles.join(', ')}` : '';
      write(doc, `${e.end} end: ${e.holes.length} hole(s)${e.boltDiameter ? `, M${e.boltDiameter} ${e.boltGrade ?? ''}`.trimEnd() : ''}${e.designCapacity != null ? `, capacity ${fixed(e.designCapacity / 1000, 1)} kN` : ''}${isGov ? ' (governs)' : ''}${chainText}`, { x: PAGE.margin, width: CONTENT_WIDTH });
      const top = doc.y + 2;
      drawEnd(doc, { x: PAGE.margin, y: top, w: CONTENT_WIDTH - 60, h: DRAWING_HEIGHT }, section, e, chainHoles);
      doc.y = top + DRAWING_HEIGHT + 6;
    }
  }

  const r = m.result;
  if (r) {
    heading(doc, `Calculation (${r.standard})`);
    for (const step of r.trace) {
      room(doc, 30);
      doc.fillColor(INK).fontSize(8.5);
      write(doc, `${step.symbol} — ${step.description}`, { x: PAGE.margin, width: CONTENT_WIDTH, weight: 'bold' });
      const value = num(step.value, step.unit);
      // Skip repeats: a formula that is only the symbol, or numbers that are already the value.
      const named = step.formula === step.symbol || step.formula.replace(/\s/g, '').startsWith(`${step.symbol.replace(/\s/g, '')}=`);
      const parts = [named ? step.formula : `${step.symbol} = ${step.formula}`];
      if (step.substituted && step.substituted !== step.formula && !value.startsWith(step.substituted)) parts.push(step.substituted);
      write(doc, `${[...parts, value].join(' = ')}`, { x: PAGE.margin + 12, width: CONTENT_WIDTH - 12 });
      doc.fillColor(MUTED).fontSize(7.5);
      write(doc, step.clause, { x: PAGE.margin + 12, width: CONTENT_WIDTH - 12 });
    }
    heading(doc, 'Failure modes');
    for (const mode of r.modes) {
      doc.fillColor(INK).fontSize(8.5);
      write(doc, `${mode.name}: ${fixed(mode.capacity / 1000, 1)} kN (${mode.clause})${mode.name === r.governing ? ' — governs' : ''}`, { x: PAGE.margin, width: CONTENT_WIDTH });
    }
    doc.fillColor(MUTED);
    write(doc, `Gross area ${fixed(r.grossArea, 0)} mm², net area ${fixed(r.netArea, 0)} mm².`, { x: PAGE.margin, width: CONTENT_WIDTH });
  }

  heading(doc, 'Assumed values');
  const assumed = assumedValues(m);
  if (!assumed.length) write(doc, 'None.', { x: PAGE.margin });
  for (const a of assumed) {
    room(doc, 14);
    doc.fillColor(INK).fontSize(8.5);
    write(doc, `${a.name} = ${a.value} — ${a.source}`, { x: PAGE.margin, width: CONTENT_WIDTH });
  }
  heading(doc, 'Warnings');
  if (!m.row.warnings.length) write(doc, 'None.', { x: PAGE.margin });
  for (const w of m.row.warnings) {
    room(doc, 14);
    doc.fillColor(INK).fontSize(8.5);
    write(doc, `• ${w}`, { x: PAGE.margin, width: CONTENT_WIDTH });
  }
}
