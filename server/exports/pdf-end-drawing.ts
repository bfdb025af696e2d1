/**
 * Vector drawing of one bolted end on the developed strip: x along the member (the end
 * at the left), y across the unfolded section. Fold lines mark where elements meet; the
 * governing fracture chain is drawn through its holes from edge to edge.
 */
import { developedStrip, type Section } from '@shared/engine';
import type { MemberEndDetail } from '@shared/api/member-detail';
import { INK, MUTED, RULE, COPPER } from './pdf-style';
import { write } from './pdf-fonts';

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Hole width used for drawing: as made, else the bolt plus a nominal 2 mm, else 20 mm. */
const drawnDiameter = (d: number | null, bolt: number | null) => d ?? (bolt ? bolt + 2 : 20);

/**
 * Draws the end into `box` (PDF points). `chain` lists indices into `end.holes` of the
 * governing chain, or null when this end does not govern or has no chain.
 */
export function drawEnd(doc: PDFKit.PDFDocument, box: Box, section: Section, end: MemberEndDetail, chain: number[] | null): void {
  const strip = developedStrip(section);
  const W = strip.width;
  const holes = end.holes;
  const maxD = Math.max(...holes.map((h) => drawnDiameter(h.d, end.boltDiameter)), 10);
  const maxX = Math.max(...holes.map((h) => h.x), 0);
  const L = maxX + Math.max(3 * maxD, 0.25 * maxX, 40);
  const s = Math.min((box.w - 40) / L, (box.h - 30) / W);
  // Origin: top-left of the strip; member end on the left, y downwards on the page.
  const ox = box.x + 30;
  const oy = box.y + 12;
  const X = (x: number) => ox + x * s;
  const Y = (y: number) => oy + y * s;

  doc.save();
  doc.lineWidth(0.8).strokeColor(INK);
  // Member end (solid), long edges, then a break line where the drawing stops.
  doc.moveTo(X(L), Y(0)).lineTo(X(0), Y(0)).lineTo(X(0), Y(W)).lineTo(X(L), Y(W)).stroke();
  const zig = 6;
  doc.moveTo(X(L), Y(0));
  for (let i = 1; i <= zig; i++) doc.lineTo(X(L) + (i % 2 ? 4 : -4), Y((W * i) / zig));
  doc.lineWidth(0.5).stroke();

  // Fold lines between the elements of the section, with the element names.
  doc.fontSize(6.5).fillColor(MUTED);
  for (const seg of strip.segments) {
    if (seg.y0 > 0) doc.moveTo(X(0), Y(seg.y0)).lineTo(X(L), Y(seg.y0)).dash(3, { space: 2 }).strokeColor(RULE).stroke().undash();
    doc.text(seg.element, X(L) + 8, (Y(seg.y0) + Y(seg.y1)) / 2 - 3, { lineBreak: false });
  }

  // Holes, numbered from 0 in the order the check lists them (as the trace counts them).
  holes.forEach((h, i) => {
    const r = (drawnDiameter(h.d, end.boltDiameter) / 2) * s;
    doc.lineWidth(0.7).strokeColor(INK);
    if (h.d == null) doc.dash(2, { space: 1.5 });
    doc.circle(X(h.x), Y(h.y), Math.max(r, 1.2)).stroke().undash();
    doc.fillColor(INK).fontSize(6).text(String(i), X(h.x) + r + 1, Y(h.y) - r - 5, { lineBreak: false });
  });

  if (chain?.length) drawChain(doc, chain.map((i) => holes[i]).filter(Boolean), strip.segments, W, X, Y);

  // Scale note and axis labels so the drawing can be read without the text.
  doc.fillColor(MUTED).fontSize(6.5);
  doc.text('end', X(0) - 22, Y(W / 2) - 3, { lineBreak: false });
  write(doc, `x along member →   developed width ${W.toFixed(0)} mm   (1 mm = ${(s / 2.8346).toFixed(2)} mm on paper)`, { x: X(0), y: Y(W) + 5, lineBreak: false });
  doc.restore();
}

/** Edge → holes → edge, broken where consecutive holes lie on different branches. */
function drawChain(
  doc: PDFKit.PDFDocument,
  holes: { x: number; y: number }[],
  segments: readonly { y0: number; y1: number; part: number }[],
  W: number,
  X: (x: number) => number,
  Y: (y: number) => number,
): void {
  const partOf = (y: number) => segments.find((g) => y >= g.y0 - 1e-6 && y <= g.y1 + 1e-6)?.part ?? 0;
  const sorted = [...holes].sort((a, b) => a.y - b.y);
  doc.save().lineWidth(1.4).strokeColor(COPPER);
  let prev: { x: number; y: number } | null = null;
  doc.moveTo(X(sorted[0].x), Y(0));
  for (const h of sorted) {
    if (prev && partOf(prev.y) !== partOf(h.y)) doc.moveTo(X(h.x), Y(h.y));
    else doc.lineTo(X(h.x), Y(h.y));
    prev = h;
  }
  doc.lineTo(X(sorted[sorted.length - 1].x), Y(W)).stroke();
  doc.restore();
}
