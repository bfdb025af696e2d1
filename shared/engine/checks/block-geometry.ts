import type { PreparedMember } from './prepare-member.ts';

/** One candidate tear-out block: areas mm². */
export interface Block {
  description: string;
  Agv: number;
  Anv: number;
  Agt: number;
  Ant: number;
  /** True when the block is not symmetric about the force (EN 1993-1-8 3.10.2(3), eq. 3.10). */
  eccentric: boolean;
}

/**
 * Candidate blocks at a bolted end, from the connected gauge lines (design-rules §5).
 * Supported: a flat (both long edges free), an angle leg (toe free, heel attached) and
 * a channel web (no free edge). Patterns:
 *  - central: shear along two lines i < j, tension between them (two shear planes);
 *  - edge: shear along one line, tension from it to a free edge.
 * Shear plane of a line: from the member end (e1 before its nearest hole) to its last
 * hole; Anv deducts (n − ½) holes. Tension planes ignore stagger credit (conservative).
 * `dh` is the hole width the standard deducts, mm. Returns [] with a reason when the
 * geometry is not supported or e1 is unknown.
 */
export function blocks(m: PreparedMember, dh: (d: number, deducted: number) => number): { blocks: Block[]; reason?: string } {
  const e1 = m.input.bolts?.endDistance;
  if (e1 === undefined) return { blocks: [], reason: 'block shear not checked: bolts.endDistance (e1) not given' };
  if (!m.lines.length) return { blocks: [], reason: 'block shear not checked: no connected holes' };
  const elements = new Set(m.lines.flatMap((g) => g.holes.map((h) => h.element)));
  if (elements.size !== 1) return { blocks: [], reason: 'block shear not checked: connected holes lie on more than one element' };
  const element = [...elements][0];
  const seg = m.strip.segments.find((s) => s.element === element)!;
  const shape = m.section.shape;
  const supported = shape === 'flat' || shape === 'angle' || (shape === 'channel' && element === 'web');
  if (!supported) return { blocks: [], reason: `block shear not checked: no tear-out pattern coded for the ${element} of a ${shape}` };
  const freeLow = shape === 'flat' || (shape === 'angle' && element === 'leg A');
  const freeHigh = shape === 'flat' || (shape === 'angle' && element === 'leg B');
  const t = seg.t;
  const xEnd = Math.min(...m.lines.flatMap((g) => g.holes.map((h) => h.x))) - e1;
  const plane = (k: number) => {
    const g = m.lines[k];
    const Lv = g.holes[g.holes.length - 1].x - xEnd;
    const d = dh(g.holes[0].d, g.holes[0].deducted);
    return { gv: Lv * t, nv: (Lv - (g.holes.length - 0.5) * d) * t };
  };
  const hole = (k: number) => dh(m.lines[k].holes[0].d, m.lines[k].holes[0].deducted);
  const out: Block[] = [];
  const n = m.lines.length;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const a = plane(i);
      const b = plane(j);
      let holesAcross = hole(i) / 2 + hole(j) / 2;
      for (let k = i + 1; k < j; k++) holesAcross += hole(k);
      const width = m.lines[j].y - m.lines[i].y;
      out.push({ description: `central block between gauge lines ${i + 1} and ${j + 1}`, Agv: a.gv + b.gv, Anv: a.nv + b.nv, Agt: width * t, Ant: (width - holesAcross) * t, eccentric: false });
    }
  }
  if (freeLow) {
    for (let j = 0; j < n; j++) {
      const p = plane(j);
      let holesAcross = hole(j) / 2;
      for (let k = 0; k < j; k++) holesAcross += hole(k);
      const width = m.lines[j].y - seg.y0;
      out.push({ description: `edge block from gauge line ${j + 1} to the free edge at y = ${seg.y0}`, Agv: p.gv, Anv: p.nv, Agt: width * t, Ant: (width - holesAcross) * t, eccentric: true });
    }
  }
  if (freeHigh) {
    for (let i = 0; i < n; i++) {
      const p = plane(i);
      let holesAcross = hole(i) / 2;
      for (let k = i + 1; k < n; k++) holesAcross += hole(k);
      const width = seg.y1 - m.lines[i].y;
      out.push({ description: `edge block from gauge line ${i + 1} to the free edge at y = ${Math.round(seg.y1 * 100) / 100}`, Agv: p.gv, Anv: p.nv, Agt: width * t, Ant: (width - holesAcross) * t, eccentric: true });
    }
  }
  if (!out.length) return { blocks: [], reason: 'block shear not checked: one gauge line and no free edge' };
  return { blocks: out };
}
