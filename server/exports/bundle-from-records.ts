/**
 * Builds an export bundle straight from the import pipeline's member records, without a
 * database: used by `gaugeline check` and by the writer tests.
 */
import type { StandardId } from '@shared/api/projects';
import type { ResultBand } from '@shared/api/results';
import type { MemberRecord } from '../imports/check-members';
import { ENGINE_VERSION } from '../imports/engine-version';
import type { ExportBundle, ExportMember } from './export-bundle';

export function exportMemberFromRecord(r: MemberRecord): ExportMember {
  return {
    row: {
      globalId: r.globalId,
      tag: r.tag,
      name: r.name,
      ifcClass: r.ifcClass,
      storey: r.storey,
      profile: r.profileName,
      grade: r.gradeName,
      holeCount: r.holeCount,
      lengthMm: r.lengthMm,
      designForceN: r.designForceN,
      forceSource: r.forceSource,
      netAreaMm2: r.netAreaMm2,
      designCapacityN: r.designCapacityN,
      utilisation: r.utilisation,
      governing: r.governing,
      band: r.band,
      warnings: r.detail.warnings,
    },
    result: r.result,
    detail: r.detail,
  };
}

export interface RecordSelection {
  /** `tension` (default): tension members only; `all`: every steel candidate. */
  scope?: 'tension' | 'all';
  /** Keep only these bands. */
  bands?: ResultBand[];
}

/** The same default as the routes: tension members that have a check result, most utilised first. */
export function selectRecords(records: MemberRecord[], sel: RecordSelection = {}): MemberRecord[] {
  return records
    .filter((r) => r.result && (sel.scope === 'all' || r.isTension) && (!sel.bands?.length || sel.bands.includes(r.band)))
    .sort((a, b) => (b.utilisation ?? -1) - (a.utilisation ?? -1) || a.globalId.localeCompare(b.globalId));
}

export interface RecordBundleMeta {
  projectName: string;
  modelName: string;
  fileName: string;
  revisionNumber?: number;
  standard: StandardId;
  checkedAt: string;
  generatedAt?: string;
  filterDescription: string;
}

export function bundleFromRecords(records: MemberRecord[], meta: RecordBundleMeta): ExportBundle {
  return {
    project: { name: meta.projectName },
    model: { name: meta.modelName },
    revision: { number: meta.revisionNumber ?? 1, fileName: meta.fileName, standard: meta.standard, checkedAt: meta.checkedAt },
    generatedAt: meta.generatedAt ?? new Date().toISOString(),
    engineVersion: ENGINE_VERSION,
    filterDescription: meta.filterDescription,
    members: records.map(exportMemberFromRecord),
  };
}
