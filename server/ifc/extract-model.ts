/**
 * The extraction proper, over an open read (ModelContext): units, relations, members, bolt
 * groups and their association, analysis forces, storeys and counts, as plain SI data.
 * read-model.ts decides where lines and class lists come from; this file does not care.
 */
import * as W from 'web-ifc';
import { extractAnalysisMembers } from './analysis-model.ts';
import { associateBolts } from './bolt-association.ts';
import type { BoltGroupsAnswer } from './bolt-groups-read.ts';
import { type BoltWork, extractBoltGroup, fastenerIds } from './bolts.ts';
import { DEFAULT_FORCE_PSETS, FORCE_CONVENTION } from './forces.ts';
import { IfcReadError } from './ifc-errors.ts';
import { extractMember, type MemberWork } from './members.ts';
import { ModelContext } from './model-context.ts';
import { readProfile } from './profiles.ts';
import { buildRelationsIndex } from './relations-index.ts';
import { num, str } from './step-values.ts';
import type { ExtractedModel, MemberForce, ReadOptions, StoreyInfo } from './types.ts';
import { readUnits } from './units.ts';

const COUNTED_CLASSES = [
  'IfcBeam', 'IfcBeamStandardCase', 'IfcMember', 'IfcMemberStandardCase', 'IfcColumn', 'IfcColumnStandardCase',
  'IfcPlate', 'IfcPlateStandardCase', 'IfcElementAssembly', 'IfcMechanicalFastener', 'IfcFastener', 'IfcDiscreteAccessory',
  'IfcOpeningElement', 'IfcVoidingFeature', 'IfcRelVoidsElement', 'IfcRelConnectsWithRealizingElements', 'IfcBooleanResult',
  'IfcBooleanClippingResult', 'IfcExtrudedAreaSolid', 'IfcFacetedBrep', 'IfcMappedItem', 'IfcMaterialProfileSetUsage',
  'IfcStructuralAnalysisModel', 'IfcStructuralCurveMember', 'IfcStructuralSurfaceMember', 'IfcStructuralCurveReaction',
  'IfcRelAssignsToProduct', 'IfcPropertySet', 'IfcBuildingStorey',
];

const yieldToLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

function countClasses(ctx: ModelContext): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const name of COUNTED_CLASSES) {
    const code = (W as unknown as Record<string, number>)[name.toUpperCase()];
    if (typeof code !== 'number') continue;
    const n = ctx.countOfType(code, false);
    if (n > 0) counts[name] = n;
  }
  return counts;
}

function storeys(ctx: ModelContext): StoreyInfo[] {
  return ctx.idsOfType(W.IFCBUILDINGSTOREY).map((id) => {
    const l = ctx.line(id);
    const e = num(l?.Elevation);
    return { globalId: str(l?.GlobalId) ?? `#${id}`, name: str(l?.Name) ?? '', elevation: e === undefined ? null : Math.round(e * ctx.units.lengthToMm * 100) / 100 };
  });
}

export interface ExtractInput {
  ctx: ModelContext;
  header: { schema: ExtractedModel['schema']; schemaIdentifier: string; truncated: boolean };
  options: ReadOptions;
  /** Called after each phase with its name (CPU time per phase for ReadStats). */
  mark: (phase: string) => void;
  /** The bolt groups as the reader thread read them (reader-thread.ts); read here when it gave up. */
  boltGroups?: Promise<BoltGroupsAnswer>;
}

/** Everything after the lines can be read. Throws IfcReadError when the file has no project. */
export async function extractModel({ ctx, header, options, mark, boltGroups }: ExtractInput): Promise<ExtractedModel> {
  const progress = options.progress ?? (() => {});
  const forceSpecs = options.forcePsetNames?.length ? options.forcePsetNames : DEFAULT_FORCE_PSETS;
  const projectId = ctx.idsOfType(W.IFCPROJECT)[0];
  if (projectId === undefined) throw new IfcReadError(header.truncated ? 'ifc.truncated' : 'ifc.no-project');
  ctx.units = readUnits(ctx, projectId);
  if (header.truncated) ctx.warnings.add('file.truncated', 'The file ends early; only what survived was read.');
  const ix = buildRelationsIndex(ctx);
  mark('relations');

  const memberIds = [...new Set([W.IFCMEMBER, W.IFCBEAM, W.IFCCOLUMN, W.IFCPLATE].flatMap((t) => ctx.idsOfType(t, true)))].sort((a, b) => a - b);
  const fasteners = fastenerIds(ctx);
  const total = memberIds.length + fasteners.length + 1;
  const works: MemberWork[] = [];
  let done = 0;
  mark('lists');
  for (const id of memberIds) {
    try {
      const w = extractMember(ctx, ix, id, forceSpecs);
      if (w) works.push(w);
    } catch (e) {
      ctx.warnings.add('member.read-failed', 'A member could not be read and was skipped.', `#${id}: ${e instanceof Error ? e.message : String(e)}`);
    }
    if (++done % 200 === 0) {
      progress('extracting', done / total);
      await yieldToLoop();
    }
  }
  mark('members');
  const fromThread = boltGroups ? await boltGroups : null;
  const bolts: BoltWork[] = fromThread?.ok ? fromThread.bolts : [];
  if (fromThread?.ok) {
    ctx.warnings.merge(fromThread.warnings);
    ctx.linesRead += fromThread.linesRead;
    done += fasteners.length;
  } else for (const id of fasteners) {
    const b = extractBoltGroup(ctx, ix, id);
    if (b) bolts.push(b);
    // Bolt groups can outnumber members; keep reporting so the progress bar does not stall.
    if (++done % 200 === 0) {
      progress('extracting', done / total);
      await yieldToLoop();
    }
  }
  mark('bolt groups');
  associateBolts(ctx, ix, works, bolts);
  mark('bolt association');
  const analysisMembers = extractAnalysisMembers(ctx, ix);
  applyAnalysisForces(works, analysisMembers);
  progress('extracting', 1);

  mark('analysis');
  const project = ctx.line(projectId);
  const model: ExtractedModel = {
    schema: header.schema,
    schemaIdentifier: header.schemaIdentifier,
    units: ctx.units,
    project: str(project?.LongName) ?? str(project?.Name),
    storeys: storeys(ctx),
    members: works.map((w) => w.member).sort((a, b) => a.globalId.localeCompare(b.globalId)),
    boltGroups: bolts.map((b) => b.group).sort((a, b) => a.globalId.localeCompare(b.globalId)),
    analysisMembers,
    profileDefinitions: options.listProfiles === false ? [] : profileDefinitions(ctx),
    forceConvention: FORCE_CONVENTION,
    warnings: ctx.warnings.list(),
    counts: countClasses(ctx),
  };
  mark('profiles, counts, sorting');
  return model;
}

function profileDefinitions(ctx: ModelContext): ExtractedModel['profileDefinitions'] {
  const out: ExtractedModel['profileDefinitions'] = [];
  for (const id of ctx.idsOfType(W.IFCPARAMETERIZEDPROFILEDEF, true).sort((a, b) => a - b)) {
    const p = readProfile(ctx, id);
    if (p?.fromParameters && p.geometry.section) out.push({ expressId: id, ifcClass: ctx.className(id), name: p.geometry.name, section: p.geometry.section });
  }
  return out;
}

/** Analysis results reach physical members through product links; one value per load case. */
function applyAnalysisForces(works: MemberWork[], analysis: ExtractedModel['analysisMembers']): void {
  const byGid = new Map(works.map((w) => [w.member.globalId, w.member]));
  for (const a of analysis) {
    const perCase = new Map<string, number>();
    for (const f of a.endForces) perCase.set(f.loadCase, Math.max(perCase.get(f.loadCase) ?? -Infinity, f.internalAxial));
    for (const gid of a.linkedPhysicalGlobalIds) {
      const m = byGid.get(gid);
      if (!m) continue;
      for (const [loadCase, n] of perCase) {
        const force: MemberForce = { loadCase, axialForce: n, source: 'analysis-model', from: a.globalId };
        m.forces.push(force);
      }
      if (a.predefinedType && ['TENSION_MEMBER', 'CABLE'].includes(a.predefinedType) && !m.tensionSignals.includes(`analysis:${a.predefinedType}`)) {
        m.tensionSignals.push(`analysis:${a.predefinedType}`);
        if (!m.notSteelReason) m.isTensionCandidate = true;
      }
    }
  }
}
