import { compareRevisions, holeSignature, type ComparableMember, type RevisionComparison } from '@shared/compare/compare-revisions';
import type { MemberDetail } from '@shared/api/member-detail';
import { MemberModel } from '../../db/models/member';
import type { RevisionModel } from '../../db/models/revision';
import { errors } from '../../http/errors';

async function comparable(revisionId: number): Promise<ComparableMember[]> {
  const rows = await MemberModel.findAll({
    where: { revisionId },
    attributes: ['globalId', 'tag', 'name', 'profileName', 'gradeName', 'designForceN', 'utilisation', 'band', 'detail'],
  });
  return rows.map((m) => ({
    globalId: m.globalId,
    tag: m.tag,
    name: m.name,
    profile: m.profileName,
    grade: m.gradeName,
    holeSignature: holeSignature(((m.detail as MemberDetail).ends ?? []).flatMap((e) => e.holes.map((h) => ({ x: h.x, y: h.y, d: h.d })))),
    designForceN: m.designForceN,
    utilisation: m.utilisation,
    band: m.band,
  }));
}

/** Compares two done revisions of the same model; `before` must be the earlier one. */
export async function compareStoredRevisions(before: RevisionModel, after: RevisionModel): Promise<RevisionComparison> {
  if (before.modelId !== after.modelId) throw errors.validation('Only revisions of the same model can be compared.');
  if (before.status !== 'done' || after.status !== 'done') throw errors.conflict('Both revisions must have finished importing.');
  return compareRevisions(await comparable(before.id), await comparable(after.id));
}
