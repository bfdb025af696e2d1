/**
 * Input validation shared by the CLI and the server (zod 4). Units: mm, MPa, N
 * (the CLI's member file uses kN for force and is converted before the engine sees it).
 * Every message names the problem so `formatIssue` can print "path: problem".
 */
import { z } from 'zod';
import { developedWidth } from './sections/developed-strip.ts';
import type { Section } from './section-types.ts';

const num = (what = 'a number') => z.number({ error: (iss) => (iss.input === undefined ? 'is required' : `must be ${what}, got ${JSON.stringify(iss.input) ?? String(iss.input)}`) });
/** A length in mm, > 0. */
export const positiveMm = () => num('a positive number (mm)').positive({ error: (iss) => `must be greater than 0 mm, got ${String(iss.input)}` });
const nonNegative = (unit: string) => num(`a number (${unit})`).nonnegative({ error: (iss) => `must not be negative, got ${String(iss.input)} ${unit}` });
const positive = (unit: string) => num(`a positive number (${unit})`).positive({ error: (iss) => `must be greater than 0${unit ? ` ${unit}` : ''}, got ${String(iss.input)}` });

/** Format a zod issue as one line: `holes[2].y: problem`. */
export function formatIssue(issue: z.core.$ZodIssue): string {
  const path = issue.path.reduce<string>((acc, key) => (typeof key === 'number' ? `${acc}[${key}]` : acc ? `${acc}.${String(key)}` : String(key)), '');
  return `${path || 'input'}: ${issue.message}`.replace(/\s*\n\s*/g, ' ');
}

/** Section (see section-types.ts), all dimensions mm > 0. */
export const sectionSchema = z.discriminatedUnion('shape', [
  z.object({ shape: z.literal('flat'), width: positiveMm(), thickness: positiveMm() }),
  z.object({
    shape: z.literal('angle'), legA: positiveMm(), legB: positiveMm(), thickness: positiveMm(),
    rootRadius: nonNegative('mm').optional(), toeRadius: nonNegative('mm').optional(), connectedLeg: z.enum(['A', 'B']).optional(),
  }),
  z.object({
    shape: z.enum(['channel', 'i', 'tee']), depth: positiveMm(), flangeWidth: positiveMm(), webThickness: positiveMm(), flangeThickness: positiveMm(),
    rootRadius: nonNegative('mm').optional(), toeRadius: nonNegative('mm').optional(),
  }),
  z.object({ shape: z.literal('round-bar'), diameter: positiveMm() }),
  z.object({ shape: z.literal('chs'), diameter: positiveMm(), thickness: positiveMm() }),
  z.object({ shape: z.literal('rhs'), depth: positiveMm(), width: positiveMm(), thickness: positiveMm(), outerRadius: nonNegative('mm').optional() }),
], { error: (iss) => (iss.code === 'invalid_union' ? 'shape must be one of flat, angle, channel, i, tee, round-bar, chs, rhs' : undefined) });

/** Geometric sanity the types cannot express (thickness less than the legs, etc.). */
export function sectionProblem(s: Section): { path: string; message: string } | null {
  switch (s.shape) {
    case 'flat':
      return null;
    case 'angle':
      return s.thickness >= Math.min(s.legA, s.legB) ? { path: 'thickness', message: `${s.thickness} mm is not less than the shorter leg (${Math.min(s.legA, s.legB)} mm)` } : null;
    case 'channel': case 'i': case 'tee':
      if (2 * s.flangeThickness >= s.depth) return { path: 'flangeThickness', message: `${s.flangeThickness} mm is too large for a ${s.depth} mm depth` };
      return s.webThickness >= s.flangeWidth ? { path: 'webThickness', message: `${s.webThickness} mm is not less than the flange width` } : null;
    case 'chs':
      return 2 * s.thickness >= s.diameter ? { path: 'thickness', message: `${s.thickness} mm is too large for a ${s.diameter} mm diameter` } : null;
    case 'rhs':
      return 2 * s.thickness >= Math.min(s.width, s.depth) ? { path: 'thickness', message: `${s.thickness} mm is too large for the section` } : null;
    case 'round-bar':
      return null;
  }
}

/** Pattern file of `gaugeline net-area`: d is the deducted width (no allowance added). */
export const netAreaPatternSchema = z.object({
  width: positiveMm(),
  thickness: positiveMm(),
  holes: z.array(z.object({ x: num('a number (mm)'), y: num('a number (mm)'), d: positiveMm() }), { error: 'must be an array of holes' }),
}).superRefine((p, ctx) => {
  p.holes.forEach((h, i) => {
    if (h.y < 0 || h.y > p.width) ctx.addIssue({ code: 'custom', path: ['holes', i, 'y'], message: `hole centre ${h.y} mm lies outside the ${p.width} mm developed width` });
  });
});

/** Bolt group at the end being checked: diameters and distances mm, fu MPa. */
export const boltGroupSchema = z.object({
  /** Bolt diameter, mm. */
  diameter: positiveMm(),
  /** Property class or ASTM grade: "4.6", "8.8", "10.9", "A325", "A490", "F3125-A325", "group-a" … */
  grade: z.string().min(1),
  /** Number of bolts; default = number of holes in the connected elements. */
  count: z.number().int().positive().optional(),
  shearPlanes: z.number().int().positive().default(1),
  /** True when threads may lie in a shear plane (the usual assumption). */
  threadsInShearPlane: z.boolean().default(true),
  holeType: z.enum(['standard', 'oversize', 'short-slot', 'long-slot']).default('standard'),
  /** End distance e1 from the member end to the nearest hole centre, along the force, mm. */
  endDistance: positiveMm().optional(),
  /** Edge distance e2 from a hole centre to the free edge across the force, mm (default from geometry). */
  edgeDistance: positiveMm().optional(),
  /** Pitch p1 along the force, mm (default from the holes). */
  pitch: positiveMm().optional(),
  /** Gauge p2 between lines across the force, mm (default from the holes). */
  gauge: positiveMm().optional(),
  /** Other plies the bolts bear on (gusset, splice plates): thickness mm, fu MPa, end distance mm. */
  plies: z.array(z.object({ thickness: positiveMm(), fu: positive('MPa'), endDistance: positiveMm().optional() })).default([]),
  /** AISC J3.10: deformation at the bolt hole is a design consideration (default true). */
  deformationConsidered: z.boolean().default(true),
});

/** One hole on the developed strip, mm. */
export const holeSchema = z.object({
  /** Along the member axis, mm. */
  x: num('a number (mm)'),
  /** Across the developed width from y = 0 (see sections/developed-strip.ts), mm. */
  y: num('a number (mm)'),
  /** Hole diameter (or slot width across the force) as made, mm; default from the bolt and the standard. */
  d: positiveMm().optional(),
});

/** Steel: a grade name, explicit fy/fu (MPa), or both (explicit values win). */
export const steelSchema = z.object({
  grade: z.string().min(1).optional(),
  fy: positive('MPa').optional(),
  fu: positive('MPa').optional(),
}).refine((s) => s.grade !== undefined || (s.fy !== undefined && s.fu !== undefined), { error: 'needs a grade or both fy and fu (MPa)' });

/** Design standard selector. */
export const standardSchema = z.enum(['as4100', 'aisc360', 'en1993'], { error: (iss) => `must be one of as4100, aisc360, en1993, got ${JSON.stringify(iss.input)}` });

/** Everything a member check needs. Forces in N (tension positive), lengths mm, stresses MPa. */
export const memberCheckInputSchema = z.object({
  standard: standardSchema,
  /** as4100: '1998' | '2020'; aisc360: '360-16' | '360-22' | '360-05' (bolt shear/block shear only); en1993: '2005'. */
  edition: z.string().optional(),
  /** AISC only: LRFD (φ) or ASD (Ω). */
  method: z.enum(['lrfd', 'asd']).default('lrfd'),
  section: sectionSchema,
  /** Tabulated gross area, mm², preferred over the computed one (design-rules §2.6). */
  grossArea: positive('mm²').optional(),
  /** Connection eccentricity x̄ for shear lag, mm (default computed from the section). */
  xBar: nonNegative('mm').optional(),
  steel: steelSchema,
  /** Holes at the end being checked, on the developed strip. */
  holes: z.array(holeSchema).default([]),
  bolts: boltGroupSchema.optional(),
  /** Connection length l (first to last fastener, or weld length), mm; default = x-extent of the connected holes. */
  connectionLength: nonNegative('mm').optional(),
  /** Fasteners per line in the direction of force; default from the hole pattern. */
  fastenersPerLine: z.number().int().nonnegative().optional(),
  /** How the end is made: bolted (default with holes) or welded (longitudinal welds). */
  connection: z.enum(['bolted', 'welded']).optional(),
  /** Elements the end connection engages; default inferred from the holes (or the angle's connectedLeg). */
  connected: z.enum(['all', 'leg A', 'leg B', 'flanges', 'flange', 'web']).optional(),
  /** 'splice-plate' applies AISC J4.1(b) An ≤ 0.85·Ag. */
  role: z.enum(['member', 'splice-plate']).default('member'),
  /** Design tension, N (tension positive); null/absent → utilisation null. */
  force: z.number().nullable().optional(),
  overrides: z.object({
    kt: positive('').max(1, { error: 'must not exceed 1' }).optional(),
    U: positive('').max(1, { error: 'must not exceed 1' }).optional(),
    gammaM0: positive('').optional(),
    gammaM2: positive('').optional(),
    /** Hole diameter as made, mm, for every hole (overrides the bolt rule and each hole's d). */
    holeDiameter: positiveMm().optional(),
    /** AISC B4.3b damage allowance, mm (default 2 mm; 1/16 in = 1.5875 mm for imperial work). */
    holeAllowance: nonNegative('mm').optional(),
    /** Block shear: AISC Ubs / AS kbs (default 1.0, uniform tension). */
    ubs: positive('').max(1).optional(),
  }).default({}),
  settings: z.object({
    /** EN: fy/fu from the product standard (EN 10025-2) or EN 1993-1-1 Table 3.1. */
    gradeSource: z.enum(['product-standard', 'table-3.1']).default('product-standard'),
    /** Same-gauge-line tolerance, mm. */
    yTolerance: nonNegative('mm').default(0.5),
  }).default({ gradeSource: 'product-standard', yTolerance: 0.5 }),
}).superRefine((m, ctx) => {
  const problem = sectionProblem(m.section as Section);
  if (problem) {
    ctx.addIssue({ code: 'custom', path: ['section', problem.path], message: problem.message });
    return;
  }
  const width = developedWidth(m.section as Section);
  m.holes.forEach((h, i) => {
    if (h.y < 0 || h.y > width) ctx.addIssue({ code: 'custom', path: ['holes', i, 'y'], message: `hole centre ${h.y} mm lies outside the ${fmtW(width)} mm developed width` });
    if (h.d === undefined && m.bolts === undefined && m.overrides.holeDiameter === undefined) ctx.addIssue({ code: 'custom', path: ['holes', i, 'd'], message: 'hole diameter missing and no bolt diameter to derive it from' });
  });
});

function fmtW(w: number): string {
  return String(Math.round(w * 100) / 100);
}

/** Validated member-check input (defaults filled). */
export type MemberCheckInput = z.output<typeof memberCheckInputSchema>;
/** Member-check input as callers write it (before defaults). */
export type MemberCheckInputRaw = z.input<typeof memberCheckInputSchema>;
/** Validated bolt group. */
export type BoltGroup = z.output<typeof boltGroupSchema>;
