/**
 * "Kestrel Yard maintenance shed": an invented single-storey steel shed, 12 m × 6 m, eaves at
 * 4 m. The authored definitions below are the truth the generator writes and the round-trip
 * test compares against (holes in the engine's section frame, forces in N, tension positive).
 */
export type V3 = [number, number, number];

export type ProfileSpec =
  | { kind: 'angle'; name: string; legA: number; legB: number; t: number }
  | { kind: 'flat'; name: string; width: number; t: number }
  | { kind: 'round'; name: string; d: number }
  | { kind: 'named'; name: string };

export interface AuthoredHole {
  x: number;
  u: number;
  v: number;
  diameter: number;
  thickness: number;
  axis: 'u' | 'v';
}

export interface AuthoredBoltGroup {
  key: string;
  diameter: number;
  length: number;
  grade: string;
  holeDiameter: number;
  /** One IfcMechanicalFastener with a mapped item per bolt, or one fastener per bolt. */
  style: 'group' | 'per-bolt';
  /** Indices into the member's holes that these bolts pass through. */
  holes: number[];
  /** Written as IfcRelConnectsWithRealizingElements between the member and this one. */
  connects?: string;
}

export interface AuthoredMember {
  key: string;
  ifcClass: 'IfcMember' | 'IfcPlate' | 'IfcColumn';
  name: string;
  /** IFC4 PredefinedType (IFC2X3 writes it into ObjectType). */
  predefinedType: string;
  objectType: string | null;
  profile: ProfileSpec;
  material: string;
  /** Placement origin, mm, and the member's local x axis (z runs from start to end). */
  start: V3;
  end: V3;
  xAxis: V3;
  holes: AuthoredHole[];
  holeStyle: 'opening' | 'boolean' | 'none';
  bolts: AuthoredBoltGroup[];
  assembly?: 'T1';
  /** Design forces written to Gaugeline_MemberForces (one set per load case); N, tension positive. */
  forces: { loadCase: string; N: number }[];
}

const Y: V3 = [0, 1, 0];
const X: V3 = [1, 0, 0];

/** Local x for a member lying in a plane with normal n: in the plane, square to the member. */
function inPlane(start: V3, end: V3, n: V3): V3 {
  const d = [end[0] - start[0], end[1] - start[1], end[2] - start[2]];
  const l = Math.hypot(d[0], d[1], d[2]);
  const z = d.map((v) => v / l);
  const x: V3 = [n[1] * z[2] - n[2] * z[1], n[2] * z[0] - n[0] * z[2], n[0] * z[1] - n[1] * z[0]];
  const xl = Math.hypot(...x);
  return x.map((v) => Math.round((v / xl) * 1e12) / 1e12) as V3;
}

/** Two staggered lines of bolts in the connected leg of an angle, measured from one end. */
function staggered(len: number, atEnd: boolean, legA: number, t: number, d0: number, gauges: [number, number], pitch: number, count: number): AuthoredHole[] {
  const holes: AuthoredHole[] = [];
  for (let i = 0; i < count; i++) {
    const s = 35 + (i * pitch) / 2;
    holes.push({ x: atEnd ? len - s : s, u: gauges[i % 2], v: t / 2, diameter: d0, thickness: t, axis: 'v' });
  }
  void legA;
  return holes;
}

function inLine(len: number, t: number, d0: number, n: number, pitch: number): AuthoredHole[] {
  const holes: AuthoredHole[] = [];
  for (const atEnd of [false, true]) {
    for (let i = 0; i < n; i++) {
      const s = 40 + i * pitch;
      holes.push({ x: atEnd ? len - s : s, u: 0, v: 0, diameter: d0, thickness: t, axis: 'v' });
    }
  }
  return holes;
}

const chordL = 12000;
const bc = { legA: 80, legB: 80, t: 8 };
const bcHoles = [...staggered(chordL, false, bc.legA, bc.t, 18, [30, 55], 70, 4), ...staggered(chordL, true, bc.legA, bc.t, 18, [30, 55], 70, 4)];
const braceLen = Math.round(Math.hypot(6000, 4000));
const ea = { legA: 75, legB: 75, t: 6 };
const eaHoles = [...staggered(braceLen, false, ea.legA, ea.t, 22, [28, 50], 60, 3), ...staggered(braceLen, true, ea.legA, ea.t, 22, [28, 50], 60, 3)];

export const KESTREL_MEMBERS: AuthoredMember[] = [
  {
    key: 'T1-BC', ifcClass: 'IfcMember', name: 'Truss T1 bottom chord', predefinedType: 'CHORD', objectType: null,
    profile: { kind: 'angle', name: 'L80x80x8', ...bc }, material: 'S355J2',
    start: [0, bc.legB / 2, 4000], end: [chordL, bc.legB / 2, 4000], xAxis: Y,
    holes: bcHoles, holeStyle: 'opening', assembly: 'T1',
    bolts: [
      { key: 'T1-BC-W', diameter: 16, length: 45, grade: '8.8', holeDiameter: 18, style: 'group', holes: [0, 1, 2, 3], connects: 'T1-GW' },
      { key: 'T1-BC-E', diameter: 16, length: 45, grade: '8.8', holeDiameter: 18, style: 'group', holes: [4, 5, 6, 7], connects: 'T1-GE' },
    ],
    forces: [{ loadCase: 'ULS1 dead+snow', N: 182_000 }, { loadCase: 'ULS2 dead+wind uplift', N: -64_000 }],
  },
  {
    key: 'T1-TCW', ifcClass: 'IfcMember', name: 'Truss T1 top chord west', predefinedType: 'CHORD', objectType: null,
    profile: { kind: 'angle', name: 'L90x90x8', legA: 90, legB: 90, t: 8 }, material: 'S355J2',
    start: [0, 45, 4000], end: [6000, 45, 5500], xAxis: Y, holes: [], holeStyle: 'none', bolts: [], assembly: 'T1',
    forces: [{ loadCase: 'ULS1 dead+snow', N: -195_000 }],
  },
  {
    key: 'T1-TCE', ifcClass: 'IfcMember', name: 'Truss T1 top chord east', predefinedType: 'CHORD', objectType: null,
    profile: { kind: 'angle', name: 'L90x90x8', legA: 90, legB: 90, t: 8 }, material: 'S355J2',
    start: [6000, 45, 5500], end: [12000, 45, 4000], xAxis: Y, holes: [], holeStyle: 'none', bolts: [], assembly: 'T1',
    forces: [{ loadCase: 'ULS1 dead+snow', N: -195_000 }],
  },
  {
    key: 'T1-DW', ifcClass: 'IfcMember', name: 'Truss T1 diagonal west', predefinedType: 'MEMBER', objectType: null,
    profile: { kind: 'angle', name: 'L60x60x6', legA: 60, legB: 60, t: 6 }, material: 'S355J2',
    start: [3000, 30, 4000], end: [6000, 30, 5500], xAxis: Y,
    holes: [{ x: 40, u: 35, v: 3, diameter: 18, thickness: 6, axis: 'v' }, { x: 100, u: 35, v: 3, diameter: 18, thickness: 6, axis: 'v' }],
    holeStyle: 'opening', bolts: [], assembly: 'T1',
    forces: [{ loadCase: 'ULS1 dead+snow', N: 41_500 }],
  },
  {
    key: 'T1-DE', ifcClass: 'IfcMember', name: 'Truss T1 diagonal east', predefinedType: 'MEMBER', objectType: null,
    profile: { kind: 'angle', name: 'L60x60x6', legA: 60, legB: 60, t: 6 }, material: 'S355J2',
    start: [9000, 30, 4000], end: [6000, 30, 5500], xAxis: Y,
    holes: [], holeStyle: 'none', bolts: [], assembly: 'T1', forces: [],
  },
  {
    key: 'T1-GW', ifcClass: 'IfcPlate', name: 'Gusset plate west', predefinedType: 'NOTDEFINED', objectType: 'GUSSET_PLATE',
    profile: { kind: 'flat', name: 'PL10x250', width: 250, t: 10 }, material: 'S355J2',
    start: [0, -5, 4030], end: [400, -5, 4030], xAxis: [0, 0, 1], holes: [], holeStyle: 'none', bolts: [], assembly: 'T1', forces: [],
  },
  {
    key: 'T1-GE', ifcClass: 'IfcPlate', name: 'Gusset plate east', predefinedType: 'NOTDEFINED', objectType: 'GUSSET_PLATE',
    profile: { kind: 'flat', name: 'PL10x250', width: 250, t: 10 }, material: 'S355J2',
    start: [11600, -5, 4030], end: [12000, -5, 4030], xAxis: [0, 0, 1], holes: [], holeStyle: 'none', bolts: [], assembly: 'T1', forces: [],
  },
  {
    key: 'H1', ifcClass: 'IfcMember', name: 'Hanger H1 (hoist rail)', predefinedType: 'USERDEFINED', objectType: 'HANGER',
    profile: { kind: 'round', name: 'RD16', d: 16 }, material: 'ASTM A36',
    start: [6000, 0, 4000], end: [6000, 0, 2600], xAxis: X, holes: [], holeStyle: 'none', bolts: [],
    forces: [{ loadCase: 'ULS1 dead+snow', N: 18_200 }, { loadCase: 'SLS hoist', N: 12_000 }],
  },
  {
    key: 'WB1', ifcClass: 'IfcMember', name: 'Wall brace west 1', predefinedType: 'BRACE', objectType: null,
    profile: { kind: 'flat', name: 'FL80x10', width: 80, t: 10 }, material: 'AS/NZS 3679.1-300',
    start: [0, 0, 0], end: [0, 6000, 4000], xAxis: inPlane([0, 0, 0], [0, 6000, 4000], X), holes: inLine(braceLen, 10, 18, 2, 60), holeStyle: 'opening',
    bolts: [
      { key: 'WB1-S', diameter: 16, length: 40, grade: '8.8/S', holeDiameter: 18, style: 'per-bolt', holes: [0, 1] },
      { key: 'WB1-E', diameter: 16, length: 40, grade: '8.8/S', holeDiameter: 18, style: 'per-bolt', holes: [2, 3] },
    ],
    forces: [{ loadCase: 'ULS3 wind west', N: 96_400 }],
  },
  {
    key: 'WB2', ifcClass: 'IfcMember', name: 'Wall brace west 2', predefinedType: 'BRACE', objectType: null,
    profile: { kind: 'flat', name: 'FL80x10', width: 80, t: 10 }, material: 'AS/NZS 3679.1-300',
    start: [20, 6000, 0], end: [20, 0, 4000], xAxis: inPlane([20, 6000, 0], [20, 0, 4000], X), holes: inLine(braceLen, 10, 18, 2, 60), holeStyle: 'opening', bolts: [],
    forces: [],
  },
  {
    key: 'EB1', ifcClass: 'IfcMember', name: 'Wall brace east', predefinedType: 'BRACE', objectType: null,
    profile: { kind: 'angle', name: 'EA 75x75x6', ...ea }, material: 'ASTM A36',
    start: [12000, 0, 0], end: [12000, 6000, 4000], xAxis: X, holes: eaHoles, holeStyle: 'opening',
    bolts: [
      { key: 'EB1-S', diameter: 20, length: 50, grade: 'A325', holeDiameter: 22, style: 'group', holes: [0, 1, 2] },
      { key: 'EB1-E', diameter: 20, length: 50, grade: 'A325', holeDiameter: 22, style: 'group', holes: [3, 4, 5] },
    ],
    forces: [{ loadCase: 'ULS3 wind west', N: -22_000 }, { loadCase: 'ULS4 wind east', N: 88_300 }],
  },
  {
    key: 'ET1', ifcClass: 'IfcMember', name: 'Eaves tie north', predefinedType: 'MEMBER', objectType: 'TIE',
    profile: { kind: 'flat', name: 'FL100x10', width: 100, t: 10 }, material: 'S355J2',
    start: [0, 6000, 3900], end: [6000, 6000, 3900], xAxis: [0, 0, 1],
    holes: [{ x: 50, u: -25, v: 0, diameter: 22, thickness: 10, axis: 'v' }, { x: 50, u: 25, v: 0, diameter: 22, thickness: 10, axis: 'v' }, { x: 5950, u: 0, v: 0, diameter: 22, thickness: 10, axis: 'v' }],
    holeStyle: 'boolean', bolts: [], forces: [{ loadCase: 'ULS1 dead+snow', N: 35_000 }],
  },
  {
    key: 'RT1', ifcClass: 'IfcMember', name: 'Roof tie rod 1', predefinedType: 'USERDEFINED', objectType: 'TIEROD',
    profile: { kind: 'round', name: 'ROD M20', d: 20 }, material: 'ASTM A36',
    start: [0, 0, 4000], end: [6000, 6000, 5500], xAxis: [0.7071067811865476, -0.7071067811865476, 0], holes: [], holeStyle: 'none', bolts: [],
    forces: [{ loadCase: 'ULS4 wind east', N: 51_000 }],
  },
  {
    key: 'RT2', ifcClass: 'IfcMember', name: 'Roof tie rod 2', predefinedType: 'USERDEFINED', objectType: 'TIEROD',
    profile: { kind: 'round', name: 'ROD M20', d: 20 }, material: 'ASTM A36',
    start: [0, 6000, 4000], end: [6000, 0, 5500], xAxis: [0.7071067811865476, 0.7071067811865476, 0], holes: [], holeStyle: 'none', bolts: [], forces: [],
  },
  {
    key: 'C1', ifcClass: 'IfcColumn', name: 'Column C1', predefinedType: 'COLUMN', objectType: null,
    profile: { kind: 'named', name: 'HEA160' }, material: 'S355J2',
    start: [0, 6000, 0], end: [0, 6000, 4000], xAxis: X, holes: [], holeStyle: 'none', bolts: [], forces: [{ loadCase: 'ULS1 dead+snow', N: -120_000 }],
  },
];

export const LOAD_CASES = ['ULS1 dead+snow', 'ULS2 dead+wind uplift', 'ULS3 wind west', 'ULS4 wind east', 'SLS hoist'];
