/**
 * Ties bolt groups to members, in this order: IfcRelConnectsWithRealizingElements, the same
 * element assembly, then geometry (a bolt's shank segment crosses the member's body box in
 * the member frame). Members without modelled holes get holes derived from the bolts.
 */
import type { BoltWork } from './bolts.ts';
import { holeInFrame } from './holes.ts';
import { add, scale, transformPoint } from './mat4.ts';
import type { MemberWork } from './members.ts';
import type { ModelContext } from './model-context.ts';
import type { RelationsIndex } from './relations-index.ts';
import type { Vec3 } from './types.ts';

const TOL = 1; // mm, box inflation for the crossing test
/** Cell numbers: indices from -CELL_OFFSET to CELL_OFFSET - 1 on each axis (2 m cells: ±131 km). */
const CELL_OFFSET = 65_536;
const CELL_SPAN = 2 * CELL_OFFSET;

interface Box3 {
  min: Vec3;
  max: Vec3;
}

/** Slab test: does segment a→b meet the box? */
function segmentHitsBox(a: Vec3, b: Vec3, box: Box3): boolean {
  let t0 = 0;
  let t1 = 1;
  for (let i = 0; i < 3; i++) {
    const d = b[i] - a[i];
    if (Math.abs(d) < 1e-12) {
      if (a[i] < box.min[i] || a[i] > box.max[i]) return false;
      continue;
    }
    let ta = (box.min[i] - a[i]) / d;
    let tb = (box.max[i] - a[i]) / d;
    if (ta > tb) [ta, tb] = [tb, ta];
    t0 = Math.max(t0, ta);
    t1 = Math.min(t1, tb);
    if (t0 > t1) return false;
  }
  return true;
}

function frameBox(w: MemberWork): Box3 | null {
  const p = w.frame.profile?.box;
  const L = w.frame.length;
  if (!p || !L || p.maxX - p.minX <= 0 || p.maxY - p.minY <= 0) return null;
  const z0 = w.frame.sSign > 0 ? 0 : -L;
  return { min: [p.minX - TOL, p.minY - TOL, z0 - TOL], max: [p.maxX + TOL, p.maxY + TOL, z0 + L + TOL] };
}

function worldBox(w: MemberWork, local: Box3): Box3 {
  const min: Vec3 = [Infinity, Infinity, Infinity];
  const max: Vec3 = [-Infinity, -Infinity, -Infinity];
  for (let c = 0; c < 8; c++) {
    const p = transformPoint(w.frame.toWorld, [c & 1 ? local.max[0] : local.min[0], c & 2 ? local.max[1] : local.min[1], c & 4 ? local.max[2] : local.min[2]]);
    for (let i = 0; i < 3; i++) {
      min[i] = Math.min(min[i], p[i]);
      max[i] = Math.max(max[i], p[i]);
    }
  }
  return { min, max };
}

interface Candidate {
  work: MemberWork;
  local: Box3;
  world: Box3;
}

/** Uniform grid over member boxes so each bolt only tests members near it (large models). */
class BoxGrid {
  private cells = new Map<number, Candidate[]>();
  /** Members too long for the walk, or placed beyond the numbered cells: tested with every bolt. */
  private shared: Candidate[] = [];
  private readonly size = 2000; // mm

  constructor(candidates: Candidate[]) {
    for (const c of candidates) {
      // A box that is not finite meets nothing (NaN lies in no cell, and must not become shared).
      if (![...c.world.min, ...c.world.max].every(Number.isFinite)) continue;
      const keys = this.keys(c.world.min, c.world.max);
      if (keys === null) {
        this.shared.push(c);
        continue;
      }
      for (const key of keys) {
        const list = this.cells.get(key);
        if (list) list.push(c);
        else this.cells.set(key, [c]);
      }
    }
  }

  /**
   * Numbered cells (a number per cell, not a string: this runs for every bolt) covering the
   * box; null when the box is too large to walk or lies beyond ±131 km, where it is shared.
   */
  private keys(min: Vec3, max: Vec3): number[] | null {
    const lo = min.map((v) => Math.floor(v / this.size));
    const hi = max.map((v) => Math.floor(v / this.size));
    if ((hi[0] - lo[0] + 1) * (hi[1] - lo[1] + 1) * (hi[2] - lo[2] + 1) > 4096) return null;
    if (lo.some((v) => !(v >= -CELL_OFFSET)) || hi.some((v) => !(v < CELL_OFFSET))) return null;
    const out: number[] = [];
    for (let i = lo[0]; i <= hi[0]; i++) for (let j = lo[1]; j <= hi[1]; j++) for (let k = lo[2]; k <= hi[2]; k++) {
      out.push(((i + CELL_OFFSET) * CELL_SPAN + (j + CELL_OFFSET)) * CELL_SPAN + (k + CELL_OFFSET));
    }
    return out;
  }

  near(bolt: BoltWork): Candidate[] {
    const found = new Set<Candidate>(this.shared);
    const r = bolt.halfLength;
    for (const p of bolt.group.positions) {
      // A bolt beyond the numbered cells can only meet the shared members.
      for (const key of this.keys([p[0] - r, p[1] - r, p[2] - r], [p[0] + r, p[1] + r, p[2] + r]) ?? []) for (const c of this.cells.get(key) ?? []) found.add(c);
    }
    return [...found].sort((a, b) => a.work.member.expressId - b.work.member.expressId);
  }
}

/** Bolt positions of a group that cross this member. */
function crossing(bolt: BoltWork, c: Candidate): Vec3[] {
  const hits: Vec3[] = [];
  for (const p of bolt.group.positions) {
    const a = add(p, scale(bolt.group.axis, -bolt.halfLength));
    const b = add(p, scale(bolt.group.axis, bolt.halfLength));
    const segMin: Vec3 = [Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.min(a[2], b[2])];
    const segMax: Vec3 = [Math.max(a[0], b[0]), Math.max(a[1], b[1]), Math.max(a[2], b[2])];
    if (segMax.some((v, i) => v < c.world.min[i]) || segMin.some((v, i) => v > c.world.max[i])) continue;
    const la = transformPoint(c.work.frame.fromWorld, a);
    const lb = transformPoint(c.work.frame.fromWorld, b);
    if (segmentHitsBox(la, lb, c.local)) hits.push(p);
  }
  return hits;
}

export function associateBolts(ctx: ModelContext, ix: RelationsIndex, members: MemberWork[], bolts: BoltWork[]): void {
  const byExpress = new Map(members.map((m) => [m.member.expressId, m]));
  const candidates: Candidate[] = [];
  for (const w of members) {
    if (w.member.notSteelReason) continue;
    const local = frameBox(w);
    if (local) candidates.push({ work: w, local, world: worldBox(w, local) });
  }
  const candByExpress = new Map(candidates.map((c) => [c.work.member.expressId, c]));
  const grid = new BoxGrid(candidates);

  for (const bolt of bolts) {
    const g = bolt.group;
    // The crossing test is asked twice per member (to link, then for the holes): once is enough.
    const hits = new Map<Candidate, Vec3[]>();
    let linked: { c: Candidate | undefined; work: MemberWork }[] = [];
    const realized = (ix.realizes.get(g.expressId) ?? []).map((id) => byExpress.get(id)).filter((w): w is MemberWork => !!w);
    if (realized.length) {
      linked = realized.map((work) => ({ c: candByExpress.get(work.member.expressId), work }));
      g.associatedBy = 'realizing-elements';
    } else {
      const parent = ix.parentOf.get(g.expressId);
      const siblings = parent === undefined ? [] : (ix.partsOf.get(parent) ?? []).map((id) => byExpress.get(id)).filter((w): w is MemberWork => !!w && !w.member.notSteelReason);
      if (siblings.length) {
        const hit = siblings.filter((w) => {
          const c = candByExpress.get(w.member.expressId);
          return c && crossOnce(hits, bolt, c).length > 0;
        });
        linked = (hit.length ? hit : siblings).map((work) => ({ c: candByExpress.get(work.member.expressId), work }));
        g.associatedBy = 'assembly';
      } else {
        linked = grid.near(bolt).filter((c) => crossOnce(hits, bolt, c).length > 0).map((c) => ({ c, work: c.work }));
        if (linked.length) g.associatedBy = 'geometry';
      }
    }
    if (!linked.length) {
      ctx.warnings.add('bolt.unassociated', 'A bolt group could not be tied to any member.', g.globalId);
      continue;
    }
    g.memberGlobalIds = [...new Set(linked.map((l) => l.work.member.globalId))].sort();
    for (const { c, work } of linked) addBoltHoles(work, bolt, c ? crossOnce(hits, bolt, c) : g.positions);
  }
}

/** crossing(bolt, c) remembered in `hits` (a plain function: under tsx a closure made per bolt group is also named per group). */
function crossOnce(hits: Map<Candidate, Vec3[]>, bolt: BoltWork, c: Candidate): Vec3[] {
  let h = hits.get(c);
  if (!h) hits.set(c, (h = crossing(bolt, c)));
  return h;
}

/** Marks modelled holes that a bolt passes through; adds derived holes where none is modelled. */
function addBoltHoles(work: MemberWork, bolt: BoltWork, positions: Vec3[]): void {
  const g = bolt.group;
  const d = g.nominalDiameter ?? 0;
  for (const p of positions) {
    const derived = holeInFrame(work.frame, p, g.axis, g.holeDiameter ?? null, 'bolt-derived', null);
    if (!derived) continue;
    const near = work.member.holes.find((h) => h.source !== 'bolt-derived' && Math.abs(h.x - derived.x) <= Math.max(d, 2) && Math.abs((h.axis === 'u' ? h.v : h.u) - (derived.axis === 'u' ? derived.v : derived.u)) <= Math.max(d, 2));
    if (near) {
      near.boltGroupGlobalId = g.globalId;
      if (g.nominalDiameter !== null) near.boltDiameter = g.nominalDiameter;
      continue;
    }
    if (g.nominalDiameter !== null) derived.boltDiameter = g.nominalDiameter;
    derived.boltGroupGlobalId = g.globalId;
    if (bolt.slot && derived.diameter !== null) {
      const extra = Math.max(bolt.slot.x, bolt.slot.y);
      derived.slot = { length: Math.round((derived.diameter + extra) * 100) / 100, width: derived.diameter };
    }
    work.member.holes.push(derived);
  }
  work.member.holes.sort((a, b) => a.x - b.x || a.u - b.u || a.v - b.v);
}
