import { Op, type WhereOptions } from 'sequelize';
import { PROJECT_LOG_ACTION_PREFIX, type projectLogQuerySchema } from '@shared/api/project-log';
import type { z } from 'zod';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { UserModel } from '../../db/models/user';
import { RevisionModel } from '../../db/models/revision';
import { IfcModelModel } from '../../db/models/ifc-model';

export type ProjectLogQuery = z.output<typeof projectLogQuerySchema>;

/** An entry's subject split into its parts: "revision:7", "member:7:<GlobalId>", "user:3", "project:1". */
export interface SubjectParts {
  type: string;
  id: number | null;
  globalId: string | null;
}

export function parseSubject(subject: string): SubjectParts {
  const [type = '', id, ...rest] = subject.split(':');
  const n = id !== undefined && /^\d+$/.test(id) ? Number(id) : null;
  // A GlobalId has 22 characters of its own alphabet, which has no ':'; join anyway for safety.
  return { type, id: n, globalId: type === 'member' && rest.length ? rest.join(':') : null };
}

export interface ProjectLogRows {
  total: number;
  entries: AuditEntryModel[];
  people: Map<number, { name: string; email: string }>;
  /** Revisions of this project named by the entries, with their model's name. */
  revisions: Map<number, { number: number; modelName: string }>;
}

/** One page of the project's entries, newest first, with the people and revisions they name. */
export async function readProjectLog(projectId: number, q: ProjectLogQuery): Promise<ProjectLogRows> {
  const where: WhereOptions = { projectId };
  if (q.kind) Object.assign(where, { action: { [Op.like]: `${PROJECT_LOG_ACTION_PREFIX[q.kind]}.%` } });
  const { count, rows } = await AuditEntryModel.findAndCountAll({
    where,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  const subjects = rows.map((r) => parseSubject(r.subject));
  const userIds = new Set<number>();
  const revisionIds = new Set<number>();
  rows.forEach((r, i) => {
    if (r.actorId != null) userIds.add(r.actorId);
    const s = subjects[i];
    if (s.type === 'user' && s.id) userIds.add(s.id);
    if ((s.type === 'revision' || s.type === 'member') && s.id) revisionIds.add(s.id);
  });
  const [users, revisions] = await Promise.all([
    userIds.size ? UserModel.findAll({ where: { id: [...userIds] }, attributes: ['id', 'name', 'email'], raw: true }) : [],
    revisionIds.size ? RevisionModel.findAll({ where: { id: [...revisionIds] }, attributes: ['id', 'number', 'modelId'], raw: true }) : [],
  ]);
  // Only this project's models: a subject can never name another project's revision in words.
  const models = revisions.length
    ? await IfcModelModel.findAll({ where: { id: [...new Set(revisions.map((r) => r.modelId))], projectId }, attributes: ['id', 'name'], raw: true })
    : [];
  const modelNames = new Map(models.map((m) => [m.id, m.name]));
  return {
    total: count,
    entries: rows,
    people: new Map(users.map((u) => [u.id, { name: u.name, email: u.email }])),
    revisions: new Map(
      revisions.filter((r) => modelNames.has(r.modelId)).map((r) => [r.id, { number: r.number, modelName: modelNames.get(r.modelId)! }]),
    ),
  };
}
