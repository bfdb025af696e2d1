import type { Sequelize } from 'sequelize';
import { identifyGrade } from '@shared/engine';
import type { SessionUser } from '@shared/api/session';
import type { MemberDetail } from '@shared/api/member-detail';
import { OVERRIDE_FIELDS, type ActiveOverrides, type MemberOverrideRequest, type MemberAuditEntry } from '@shared/api/overrides';
import { designForceFrom } from '@shared/forces/design-force';
import { MemberModel } from '../../db/models/member';
import { MemberForceModel } from '../../db/models/member-force';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { UserModel } from '../../db/models/user';
import type { RevisionModel } from '../../db/models/revision';
import { errors } from '../../http/errors';
import { recheckMember } from './recheck-member';
import { bumpResultsVersion } from './results-version';

export const memberSubject = (revisionId: number, globalId: string) => `member:${revisionId}:${globalId}`;

/**
 * Applies an engineer's overrides to one member, re-checks it at once, and records who,
 * when, what (before and after) and why — all in one transaction.
 */
export async function overrideMember(
  sequelize: Sequelize,
  user: SessionUser,
  projectId: number,
  revision: RevisionModel,
  globalId: string,
  req: MemberOverrideRequest,
): Promise<MemberModel> {
  if (req.grade && !identifyGrade(req.grade)) {
    throw errors.validation(`"${req.grade}" is not a steel grade Gaugeline knows.`, { grade: 'Unknown grade; use e.g. S355, AS/NZS 3679.1-300, A992, or give fy and fu.' });
  }
  return sequelize.transaction(async (transaction) => {
    const member = await MemberModel.findOne({ where: { revisionId: revision.id, globalId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!member) throw errors.notFound('That member');
    const detail = { ...(member.detail as MemberDetail) };
    const overrides: ActiveOverrides = { ...(detail.overrides ?? {}) };
    const change: MemberAuditEntry['change'] = {};
    const stamp = { reason: req.reason, by: user.email, at: new Date().toISOString() };
    for (const field of OVERRIDE_FIELDS) {
      const value = req[field];
      if (value === undefined) continue;
      change[field] = { before: overrides[field]?.value ?? null, after: value };
      if (value === null) delete overrides[field];
      else overrides[field] = { value, ...stamp };
    }
    if (req.inclusion !== undefined) {
      change.inclusion = { before: member.inclusion, after: req.inclusion };
      member.inclusion = req.inclusion;
      member.inclusionReason = req.inclusion === 'auto' ? null : req.reason;
    }
    detail.overrides = overrides;
    member.set('detail', detail);
    member.changed('detail', true);
    const forces = await MemberForceModel.findAll({ where: { memberId: member.id }, transaction, raw: true });
    await recheckMember(member, revision.standard, designForceFrom(forces), transaction);
    await bumpResultsVersion(revision.id, transaction);
    await AuditEntryModel.create(
      { actorId: user.id, projectId, action: 'member.override', subject: memberSubject(revision.id, globalId), detail: { change }, reason: req.reason },
      { transaction },
    );
    return member;
  });
}

/** The member's audit trail, newest first. */
export async function memberAudit(revisionId: number, globalId: string): Promise<MemberAuditEntry[]> {
  const entries = await AuditEntryModel.findAll({ where: { subject: memberSubject(revisionId, globalId) }, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 200 });
  const ids = [...new Set(entries.map((e) => e.actorId).filter((v): v is number => v != null))];
  const users = new Map((await UserModel.findAll({ where: { id: ids }, attributes: ['id', 'email'] })).map((u) => [u.id, u.email]));
  return entries.map((e) => ({
    at: e.createdAt.toISOString(),
    by: e.actorId ? (users.get(e.actorId) ?? null) : null,
    action: e.action,
    change: ((typeof e.detail === 'string' ? JSON.parse(e.detail) : e.detail) as { change?: MemberAuditEntry['change'] }).change ?? {},
    reason: e.reason,
  }));
}
