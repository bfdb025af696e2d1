import { Op, type Sequelize } from 'sequelize';
import { parseForcesCsv, type ForcesProblem } from '@shared/forces/parse-forces-csv';
import { designForceFrom } from '@shared/forces/design-force';
import { MemberModel } from '../../db/models/member';
import { MemberForceModel } from '../../db/models/member-force';
import { AuditEntryModel } from '../../db/models/audit-entry';
import type { RevisionModel } from '../../db/models/revision';
import { AppError } from '../../http/errors';
import { recheckMember } from './recheck-member';
import { bumpResultsVersion } from './results-version';

export interface ForcesReport {
  unit: string;
  rows: number;
  members: number;
  rechecked: number;
}

/**
 * Applies a forces table to a revision: every row must match a member (GlobalId, else a
 * unique Tag); any problem rejects the whole file with a per-row report and changes
 * nothing. Otherwise forces are replaced and the members re-checked in one transaction.
 */
export async function applyForcesCsv(sequelize: Sequelize, actorId: number, projectId: number, revision: RevisionModel, text: string): Promise<ForcesReport> {
  const parsed = parseForcesCsv(text);
  const problems: ForcesProblem[] = [...parsed.problems];
  const members = await MemberModel.findAll({ where: { revisionId: revision.id }, attributes: ['id', 'globalId', 'tag'] });
  const byGid = new Map(members.map((m) => [m.globalId, m.id]));
  const byTag = new Map<string, number[]>();
  for (const m of members) if (m.tag) byTag.set(m.tag, [...(byTag.get(m.tag) ?? []), m.id]);
  const matched: { memberId: number; loadCase: string; axialN: number }[] = [];
  for (const row of parsed.rows) {
    let id = row.globalId ? byGid.get(row.globalId) : undefined;
    if (!id && row.tag) {
      const ids = byTag.get(row.tag) ?? [];
      if (ids.length > 1) {
        problems.push({ line: row.line, message: `the tag "${row.tag}" belongs to ${ids.length} members; use the GlobalId` });
        continue;
      }
      id = ids[0];
    }
    if (!id) {
      problems.push({ line: row.line, message: `no member ${row.globalId ?? `with tag "${row.tag}"`} in revision ${revision.number}` });
      continue;
    }
    matched.push({ memberId: id, loadCase: row.loadCase, axialN: row.axialN });
  }
  if (problems.length) {
    problems.sort((a, b) => a.line - b.line);
    throw new AppError(422, 'forces.rejected', `The forces file was not applied: ${problems.length} problem(s). Nothing was changed.`, undefined, { problems });
  }
  const memberIds = [...new Set(matched.map((m) => m.memberId))];
  let rechecked = 0;
  await sequelize.transaction(async (transaction) => {
    await MemberForceModel.destroy({ where: { memberId: { [Op.in]: memberIds }, source: 'forces-csv' }, transaction });
    await MemberForceModel.bulkCreate(matched.map((m) => ({ ...m, source: 'forces-csv' })), { transaction });
    const all = await MemberForceModel.findAll({ where: { memberId: { [Op.in]: memberIds } }, transaction, raw: true });
    const targets = await MemberModel.findAll({ where: { id: { [Op.in]: memberIds } }, transaction });
    for (const member of targets) {
      const { force, source } = designForceFrom(all.filter((f) => f.memberId === member.id));
      if (await recheckMember(member, revision.standard, { force, source }, transaction)) rechecked++;
    }
    await bumpResultsVersion(revision.id, transaction);
    await AuditEntryModel.create(
      { actorId, projectId, action: 'forces.applied', subject: `revision:${revision.id}`, detail: { unit: parsed.unit, rows: matched.length, members: memberIds.length }, reason: null },
      { transaction },
    );
  });
  return { unit: parsed.unit, rows: matched.length, members: memberIds.length, rechecked };
}
