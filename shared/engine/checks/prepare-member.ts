import type { Section } from '../section-types.ts';
import type { MemberCheckInput } from '../schemas.ts';
import { grossArea } from '../sections/gross-area.ts';
import { developedStrip, segmentAt, type DevelopedStrip } from '../sections/developed-strip.ts';
import { connectionEccentricity, type ConnectedElements } from '../sections/eccentricity.ts';
import { holeSize, deductedWidth, type HoleStandard } from '../holes/hole-size.ts';
import { resolveSteel, type Steel } from '../materials/parse-grade.ts';
import { solveNetArea } from '../net-area/solve.ts';
import type { NetAreaResult, StripHole } from '../net-area/types.ts';
import { fmt, type Recorder } from './trace.ts';

/** A hole after sizing and locating: lengths mm. */
export interface PlacedHole {
  index: number;
  x: number;
  y: number;
  /** Hole diameter as made, mm. */
  d: number;
  /** Width deducted for net area (AISC adds the B4.3b allowance), mm. */
  deducted: number;
  t: number;
  element: string;
  part: number;
  connected: boolean;
}

/** A gauge line of connected holes, holes sorted by x. */
export interface GaugeLine {
  y: number;
  holes: PlacedHole[];
}

/** Everything the standard-specific checks share. Units mm, mm², MPa. */
export interface PreparedMember {
  input: MemberCheckInput;
  section: Section;
  Ag: number;
  strip: DevelopedStrip;
  holes: PlacedHole[];
  steel: Steel;
  net: NetAreaResult;
  connected: ConnectedElements;
  lines: GaugeLine[];
  /** Connection length l, mm (0 with one row or none). */
  l: number;
  /** Fasteners per line in the force direction (the smallest over the connected lines). */
  perLine: number;
  xBar: number | null;
  welded: boolean;
}

const ELEMENTS: Record<ConnectedElements, (e: string) => boolean> = {
  all: () => true,
  'leg A': (e) => e === 'leg A',
  'leg B': (e) => e === 'leg B',
  flanges: (e) => e.endsWith('flange'),
  flange: (e) => e.endsWith('flange'),
  web: (e) => e === 'web',
};

/** Largest element thickness, mm: AS/EN/ASTM strength bands are read at this (conservative for sections). */
export function governingThickness(s: Section): number {
  switch (s.shape) {
    case 'flat': case 'angle': case 'chs': case 'rhs': return s.thickness;
    case 'round-bar': return s.diameter;
    default: return Math.max(s.flangeThickness, s.webThickness);
  }
}

/**
 * Size and place the holes, resolve the steel, solve the net area and work out the
 * connection geometry (connected elements, gauge lines, l, fasteners per line, x̄).
 * Records every assumed value on `rec`.
 */
export function prepareMember(input: MemberCheckInput, rec: Recorder): PreparedMember {
  const section = input.section as Section;
  const standard = input.standard as HoleStandard;
  const computedAg = grossArea(section);
  const Ag = input.grossArea ?? computedAg;
  rec.assume('Ag', fmt(Ag), input.grossArea !== undefined ? 'tabulated value from the input' : 'computed from the profile dimensions (root/toe radii included where given)');
  if (input.grossArea !== undefined && Math.abs(input.grossArea - computedAg) > 0.05 * computedAg) {
    rec.warn(`The given gross area ${fmt(input.grossArea)} mm² differs from the profile's ${fmt(computedAg)} mm² by more than 5 %.`);
  }
  const strip = developedStrip(section);
  const t = governingThickness(section);
  const steel = resolveSteel(input.steel, t, { product: section.shape === 'flat' ? 'plate' : 'section', enSource: input.settings.gradeSource });
  rec.assume('fy', steel.fy, steel.source);
  rec.assume('fu', steel.fu, steel.source);

  const connected = inferConnected(input, section, strip);
  rec.assume('connected elements', connected, input.connected ? 'input' : 'inferred from the section and the hole positions');
  const isConnected = ELEMENTS[connected];
  const allowance = input.overrides.holeAllowance ?? 2;
  let sizedFromBolt = false;
  const holes: PlacedHole[] = input.holes.map((h, index) => {
    const seg = segmentAt(section, h.y, 1e-6)!;
    let d = input.overrides.holeDiameter ?? h.d;
    if (d === undefined) {
      const size = holeSize(standard, input.bolts!.diameter, input.bolts!.holeType);
      d = size.width;
      if (!sizedFromBolt) rec.assume('hole diameter', fmt(d), `${size.source}, ${input.bolts!.holeType} hole for a ${fmt(input.bolts!.diameter)} mm bolt`);
      sizedFromBolt = true;
    }
    return { index, x: h.x, y: h.y, d, deducted: deductedWidth(standard, d, allowance), t: seg.t, element: seg.element, part: seg.part, connected: isConnected(seg.element) };
  });
  if (input.overrides.holeDiameter !== undefined) rec.assume('hole diameter', input.overrides.holeDiameter, 'override (modelled or stated hole size)');
  else if (holes.length && !sizedFromBolt) rec.assume('hole diameter', [...new Set(holes.map((h) => fmt(h.d)))].join(', '), 'as given for each hole (modelled size)');
  if (standard === 'aisc360' && holes.length) rec.assume('hole allowance', fmt(allowance), 'AISC 360-16 B4.3b: nominal hole + 1/16 in (2 mm)');

  const stripHoles: StripHole[] = holes.map((h) => ({ x: h.x, y: h.y, d: h.deducted, t: h.t, part: h.part }));
  const net = solveNetArea({ grossArea: Ag, thickness: t, holes: stripHoles, yTolerance: input.settings.yTolerance });
  for (const w of net.warnings) rec.warn(w);
  const elementsHoled = new Set(holes.map((h) => h.element));
  if (strip.branched && elementsHoled.has('web') && elementsHoled.size > 1) {
    rec.warn('Holes in both the web and a flange of a branched section: each element was solved on its own and the deductions added, ignoring stagger credit across the junction (judgement, conservative).');
  }
  if (strip.closed && holes.length) rec.warn('Hollow section developed by cutting the wall at y = 0; chains do not wrap around the cut.');

  const lines = gaugeLines(holes.filter((h) => h.connected), input.settings.yTolerance);
  const xs = holes.filter((h) => h.connected).map((h) => h.x);
  const welded = input.connection === 'welded' || (input.connection === undefined && holes.length === 0 && input.connectionLength !== undefined);
  const l = input.connectionLength ?? (xs.length ? Math.max(...xs) - Math.min(...xs) : 0);
  rec.assume('connection length l', fmt(l), input.connectionLength !== undefined ? 'input' : 'x-extent of the connected holes (first to last fastener)');
  const perLine = input.fastenersPerLine ?? (lines.length ? Math.min(...lines.map((g) => g.holes.length)) : 0);
  if (!welded) rec.assume('fasteners per line', perLine, input.fastenersPerLine !== undefined ? 'input' : 'fewest holes on any connected gauge line (conservative)');
  const xBar = input.xBar ?? connectionEccentricity(section, connected);
  if (xBar !== null) rec.assume('x̄', fmt(xBar), input.xBar !== undefined ? 'input' : 'centroid distance from the connection plane, computed from the profile');
  return { input, section, Ag, strip, holes, steel, net, connected, lines, l, perLine, xBar, welded };
}

function inferConnected(input: MemberCheckInput, s: Section, strip: DevelopedStrip): ConnectedElements {
  if (input.connected) return input.connected;
  if (s.shape === 'angle') return s.connectedLeg === 'B' ? 'leg B' : 'leg A';
  if (s.shape === 'flat' || strip.closed || s.shape === 'round-bar') return 'all';
  const els = new Set(input.holes.map((h) => segmentAt(s, h.y, 1e-6)?.element ?? ''));
  const flanges = [...els].some((e) => e.endsWith('flange'));
  const web = els.has('web');
  if (flanges && !web) return s.shape === 'tee' ? 'flange' : 'flanges';
  if (web && !flanges) return 'web';
  return 'all';
}

/** Group holes into gauge lines by y (single linkage within tol, mm); holes sorted by x. */
export function gaugeLines(holes: PlacedHole[], tol: number): GaugeLine[] {
  const sorted = [...holes].sort((a, b) => a.y - b.y);
  const lines: GaugeLine[] = [];
  for (const h of sorted) {
    const last = lines[lines.length - 1];
    if (last && h.y - last.holes[last.holes.length - 1].y <= tol) last.holes.push(h);
    else lines.push({ y: h.y, holes: [h] });
  }
  for (const g of lines) g.holes.sort((a, b) => a.x - b.x);
  return lines;
}
