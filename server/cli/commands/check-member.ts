/**
 * `gaugeline check-member MEMBER.json` — tension check of a flat or angle to one standard.
 * MEMBER: { standard: as4100 | aisc360-lrfd | aisc360-asd | en1993, section, steel, holes [{x, y, d}],
 *   force (kN), kt?, U?, gammaM0?, gammaM2? } plus optional extensions (bolt, connectionLength,
 *   gradeSource, edition, grossArea, xBar, holeAllowance). d = hole diameter as made, mm.
 * Prints { grossArea, netArea (mm²), designCapacity (kN), utilisation, governing, modes, trace, assumptions, warnings }.
 */
import { z } from 'zod';
import { formatIssue, memberCheckInputSchema, positiveMm, boltGroupSchema } from '../../../shared/engine/schemas.ts';
import { checkMember } from '../../../shared/engine/checks/check-member.ts';
import { identifyGrade } from '../../../shared/engine/materials/parse-grade.ts';
import { readJsonInput } from '../read-json.ts';
import { CliInputError } from '../cli-error.ts';

const finite = z.number({ error: (iss) => (iss.input === undefined ? 'is required' : `must be a number, got ${JSON.stringify(iss.input)}`) });

const memberFileSchema = z.object({
  standard: z.enum(['as4100', 'aisc360-lrfd', 'aisc360-asd', 'en1993'], { error: (iss) => `must be one of as4100, aisc360-lrfd, aisc360-asd, en1993, got ${JSON.stringify(iss.input)}` }),
  section: z.discriminatedUnion('shape', [
    z.object({ shape: z.literal('flat'), width: positiveMm(), thickness: positiveMm() }),
    z.object({ shape: z.literal('angle'), legA: positiveMm(), legB: positiveMm(), thickness: positiveMm(), rootRadius: finite.nonnegative().optional(), toeRadius: finite.nonnegative().optional(), connectedLeg: z.enum(['A', 'B']).optional() }),
  ], { error: (iss) => (iss.code === 'invalid_union' ? 'shape must be "flat" or "angle"' : undefined) }),
  steel: z.object({ grade: z.string().optional(), fy: finite.positive().optional(), fu: finite.positive().optional() }, { error: 'must be an object with fy and fu (MPa) or grade' }),
  holes: z.array(z.object({ x: finite, y: finite, d: positiveMm() })).default([]),
  force: finite.nullable().optional(),
  kt: finite.optional(),
  U: finite.optional(),
  gammaM0: finite.optional(),
  gammaM2: finite.optional(),
  bolt: boltGroupSchema.optional(),
  connectionLength: finite.nonnegative().optional(),
  gradeSource: z.enum(['product-standard', 'table-3.1']).optional(),
  edition: z.string().optional(),
  grossArea: finite.positive().optional(),
  xBar: finite.nonnegative().optional(),
  holeAllowance: finite.nonnegative().optional(),
});

// Engine paths that are spelt differently in the member file.
const PATH_MAP: Record<string, string> = { overrides: '', bolts: 'bolt', settings: '' };

export async function run(args: string[]): Promise<void> {
  const f = await readJsonInput(args[0], memberFileSchema, 'MEMBER');
  if (f.steel.grade === undefined && (f.steel.fy === undefined || f.steel.fu === undefined)) throw new CliInputError('steel: needs fy and fu (MPa) or a grade');
  if (f.steel.grade !== undefined && !identifyGrade(f.steel.grade)) throw new CliInputError(`steel.grade: unknown steel grade "${f.steel.grade}"`);
  const [standard, method] = f.standard === 'aisc360-asd' ? ['aisc360', 'asd'] : f.standard === 'aisc360-lrfd' ? ['aisc360', 'lrfd'] : [f.standard, 'lrfd'];
  const raw = {
    standard, method, edition: f.edition,
    section: f.section, grossArea: f.grossArea, xBar: f.xBar,
    steel: f.steel, holes: f.holes, bolts: f.bolt, connectionLength: f.connectionLength,
    force: f.force === undefined || f.force === null ? null : f.force * 1000,
    overrides: { kt: f.kt, U: f.U, gammaM0: f.gammaM0, gammaM2: f.gammaM2, holeAllowance: f.holeAllowance },
    settings: { gradeSource: f.gradeSource ?? 'product-standard', yTolerance: 0.5 },
  };
  const parsed = memberCheckInputSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const path = issue.path.map((p) => (typeof p === 'string' && p in PATH_MAP ? PATH_MAP[p] : p)).filter((p) => p !== '');
    throw new CliInputError(formatIssue({ ...issue, path }));
  }
  let result;
  try {
    result = checkMember(parsed.data);
  } catch (e) {
    if (e instanceof RangeError) throw new CliInputError(`input: ${e.message}`);
    throw e;
  }
  const kN = (v: number) => round(v / 1000);
  const out = {
    grossArea: round(result.grossArea),
    netArea: round(result.netArea),
    designCapacity: kN(result.designCapacity),
    utilisation: result.utilisation === null ? null : round(result.utilisation),
    governing: result.governing,
    modes: result.modes.map((m) => ({ name: m.name, capacity: kN(m.capacity), clause: m.clause })),
    trace: result.trace.map((s) => (s.unit === 'N' ? { ...s, value: kN(s.value), unit: 'kN' } : { ...s, value: round(s.value) })),
    assumptions: result.assumptions,
    warnings: result.warnings,
  };
  const text = JSON.stringify(out);
  if (/NaN|Infinity/.test(JSON.stringify([out.grossArea, out.netArea, out.designCapacity, out.utilisation, out.modes]))) throw new CliInputError('input: the check produced a non-finite number; check the dimensions');
  process.stdout.write(`${text}\n`);
}

function round(v: number): number {
  if (!Number.isFinite(v)) throw new CliInputError('input: the check produced a non-finite number; check the dimensions');
  return Math.round(v * 1e6) / 1e6;
}
