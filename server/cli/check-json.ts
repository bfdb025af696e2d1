/**
 * The JSON answer of `gaugeline check`: one entry per member in kN and mm², with the
 * standard, engine version, units and cautions alongside, so the output stands alone.
 */
import { CAUTIONS } from '../../shared/api/cautions.ts';
import type { RevisionSummary } from '../../shared/api/models.ts';
import type { MemberRecord } from '../imports/check-members.ts';
import { ENGINE_VERSION } from '../imports/engine-version.ts';
import { exportMemberFromRecord } from '../exports/bundle-from-records.ts';
import { assumedValues, editionOf, standardLabel } from '../exports/export-text.ts';
import type { CheckOptions } from './check-options.ts';

export const CHECK_JSON_SCHEMA = 'gaugeline.check/1';

const r6 = (v: number | null) => (v == null || !Number.isFinite(v) ? null : Math.round(v * 1e6) / 1e6);
const kN = (n: number | null) => (n == null ? null : r6(n / 1000));

export function checkJson(records: MemberRecord[], summary: RevisionSummary, opts: CheckOptions, checkedAt: string): object {
  const members = records.map(exportMemberFromRecord);
  return {
    schema: CHECK_JSON_SCHEMA,
    model: { file: opts.model, ifcSchema: summary.schema, lengthUnit: summary.lengthUnit },
    standard: standardLabel(opts.standard),
    edition: editionOf({ revision: { standard: opts.standard } as never, members }),
    engineVersion: ENGINE_VERSION,
    checkedAt,
    units: { force: 'kN', designCapacity: 'kN', netArea: 'mm²', utilisation: 'design force / design capacity' },
    members: records.map((r, i) => ({
      globalId: r.globalId,
      name: r.name,
      tag: r.tag,
      ifcClass: r.ifcClass,
      profile: r.profileName,
      grade: r.gradeName,
      holeCount: r.holeCount,
      netArea: r6(r.netAreaMm2),
      force: kN(r.designForceN),
      designCapacity: kN(r.designCapacityN),
      utilisation: r.designForceN == null ? null : r6(r.utilisation),
      governing: r.governing,
      forceSource: r.forceSource,
      assumptions: assumedValues(members[i]),
      warnings: r.detail.warnings,
    })),
    warnings: summary.warnings.map((w) => (w.count > 1 ? `${w.message} (${w.count} times)` : w.message)),
    cautions: CAUTIONS,
  };
}
