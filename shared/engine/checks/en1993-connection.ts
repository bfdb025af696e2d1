import type { PreparedMember } from './prepare-member.ts';
import { fmt, type Recorder } from './trace.ts';
import { blocks } from './block-geometry.ts';
import { blockTearingEn } from './block-shear.ts';
import { ISO_FUB, normaliseBoltGrade, shankArea, stressArea } from './bolt-data.ts';

/**
 * EN 1993-1-8 bolt checks (Table 3.4, 3.7, 3.8; values via SBE Part 5 where confirmed,
 * otherwise from memory) and block tearing (3.10.2). Forces N.
 *  Fv,Rd = αv·fub·A/γM2 per plane; Fb,Rd = k1·αb·fu·d·t/γM2;
 *  group (3.7(1)): Σ Fb,Rd only if every bolt has Fv,Rd ≥ Fb,Rd, else n × the smallest resistance;
 *  long joints (3.8): Lj > 15d → βLf = 1 − (Lj − 15d)/(200d), 0.75 ≤ βLf ≤ 1.
 */
export function enConnectionModes(m: PreparedMember, rec: Recorder, gM0: number, gM2: number): void {
  const b = m.input.bolts!;
  const cls = normaliseBoltGrade(b.grade);
  const fub = ISO_FUB[cls];
  if (fub === undefined) {
    rec.warn(`Bolt class "${b.grade}" is not an EN 1993-1-8 Table 3.1 class: bolt checks skipped.`);
  } else {
    boltGroup(m, rec, cls, fub, gM2);
  }
  const found = blocks(m, (d) => d);
  if (found.reason) {
    rec.warn(found.reason);
    return;
  }
  let best = Infinity;
  for (const blk of found.blocks) {
    const v = blockTearingEn(blk, m.steel.fy, m.steel.fu, gM0, gM2, blk.eccentric);
    const eq = blk.eccentric ? '3.10' : '3.9';
    best = Math.min(best, rec.step(blk.eccentric ? 'Veff,2,Rd' : 'Veff,1,Rd', `block tearing, ${blk.description}`, `${blk.eccentric ? '0.5·' : ''}fu·Ant/γM2 + fy·Anv/(√3·γM0)`, `${blk.eccentric ? '0.5 × ' : ''}${fmt(m.steel.fu)} × ${fmt(blk.Ant)} / ${gM2} + ${fmt(m.steel.fy)} × ${fmt(blk.Anv)} / (√3 × ${gM0})`, v, 'N', `EN 1993-1-8 3.10.2 eq. ${eq}`));
  }
  rec.mode('block tearing', best, 'EN 1993-1-8 3.10.2');
}

function boltGroup(m: PreparedMember, rec: Recorder, cls: string, fub: number, gM2: number): void {
  const b = m.input.bolts!;
  const d = b.diameter;
  const n = b.count ?? m.holes.filter((h) => h.connected).length;
  const threads = b.threadsInShearPlane;
  const alphaV = !threads || ['4.6', '5.6', '8.8'].includes(cls) ? 0.6 : 0.5;
  const A = threads ? stressArea(d) : shankArea(d);
  const Lj = m.l;
  const betaLf = Lj > 15 * d ? Math.min(1, Math.max(0.75, 1 - (Lj - 15 * d) / (200 * d))) : 1;
  if (betaLf < 1) rec.step('βLf', 'long-joint reduction', '1 − (Lj − 15d)/(200d), 0.75…1.0', `Lj = ${fmt(Lj)}, d = ${fmt(d)}`, betaLf, '', 'EN 1993-1-8 3.8');
  const fv = rec.step('Fv,Rd', `shear resistance of one bolt (${b.shearPlanes} plane(s), ${threads ? 'threads, A = As' : 'shank, A = πd²/4'})`, 'planes·αv·fub·A/γM2·βLf', `${b.shearPlanes} × ${alphaV} × ${fub} × ${fmt(A)} / ${gM2} × ${fmt(betaLf)}`, (b.shearPlanes * alphaV * fub * A * betaLf) / gM2, 'N', 'EN 1993-1-8 Table 3.4, 3.8');
  rec.mode('bolt shear', n * fv, 'EN 1993-1-8 Table 3.4');
  const holeFactor = b.holeType === 'oversize' ? 0.8 : b.holeType === 'standard' ? 1 : 0.6;
  if (holeFactor < 1) rec.assume('bearing factor for hole type', holeFactor, 'EN 1993-1-8 Table 3.4 notes (from memory; slots taken as perpendicular to the force)');
  const seg = m.strip.segments.find((s) => s.element === m.lines[0]?.holes[0]?.element);
  const ys = m.lines.map((g) => g.y);
  const p2 = b.gauge ?? (ys.length > 1 ? Math.min(...ys.slice(1).map((y, i) => y - ys[i])) : Infinity);
  const freeLow = m.section.shape === 'flat' || (m.section.shape === 'angle' && m.connected === 'leg A');
  const freeHigh = m.section.shape === 'flat' || (m.section.shape === 'angle' && m.connected === 'leg B');
  const plies = [{ name: 'member', t: m.holes.find((h) => h.connected)?.t ?? 0, fu: m.steel.fu, e1: b.endDistance }, ...b.plies.map((p, i) => ({ name: `ply ${i + 1}`, t: p.thickness, fu: p.fu, e1: p.endDistance }))];
  const fbMin: number[] = [];
  m.lines.forEach((g, li) => {
    const edgeLine = li === 0 || li === m.lines.length - 1;
    const e2 = b.edgeDistance ?? Math.min(freeLow && li === 0 && seg ? g.y - seg.y0 : Infinity, freeHigh && li === m.lines.length - 1 && seg ? seg.y1 - g.y : Infinity);
    const k1 = Math.min(edgeLine && Number.isFinite(e2) ? 2.8 * (e2 / g.holes[0].d) - 1.7 : Infinity, Number.isFinite(p2) ? 1.4 * (p2 / g.holes[0].d) - 1.7 : Infinity, 2.5);
    g.holes.forEach((h, k) => {
      let fb = Infinity;
      for (const ply of plies) {
        const alphaD = k === 0 ? (ply.e1 === undefined ? Infinity : ply.e1 / (3 * h.d)) : (h.x - g.holes[k - 1].x) / (3 * h.d) - 0.25;
        const alphaB = Math.min(alphaD, fub / ply.fu, 1);
        fb = Math.min(fb, (holeFactor * k1 * alphaB * ply.fu * d * ply.t) / gM2);
      }
      fbMin.push(fb);
    });
  });
  if (b.endDistance === undefined) rec.warn('EN 1993-1-8 bearing: e1 not given, αd of the end bolts taken from fub/fu and 1.0 only.');
  const scale = n / Math.max(fbMin.length, 1);
  const sumFb = fbMin.reduce((a, v) => a + v, 0) * scale;
  rec.mode('bolt bearing', rec.step('ΣFb,Rd', 'bearing resistance of the group (each bolt: smallest over the plies)', 'Σ k1·αb·fu·d·t/γM2', `${fbMin.length} bolts`, sumFb, 'N', 'EN 1993-1-8 Table 3.4'), 'EN 1993-1-8 Table 3.4');
  const allShearStronger = fbMin.every((fb) => fv >= fb);
  const group = allShearStronger ? sumFb : n * Math.min(fv, ...fbMin);
  rec.mode('bolt group (3.7(1))', rec.step('Fgroup,Rd', allShearStronger ? 'group = Σ Fb,Rd (every Fv,Rd ≥ Fb,Rd)' : 'group = n × smallest individual resistance (some Fv,Rd < Fb,Rd)', allShearStronger ? 'Σ Fb,Rd' : 'n·min(Fv,Rd, Fb,Rd)', allShearStronger ? fmt(sumFb) : `${n} × ${fmt(Math.min(fv, ...fbMin))}`, group, 'N', 'EN 1993-1-8 3.7(1)'), 'EN 1993-1-8 3.7(1)');
}
