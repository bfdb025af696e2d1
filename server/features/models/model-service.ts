import { Op } from 'sequelize';
import { IfcModelModel } from '../../db/models/ifc-model';
import { RevisionModel } from '../../db/models/revision';
import { UserModel } from '../../db/models/user';
import { errors } from '../../http/errors';
import { presentModel, presentRevision } from './model-presenter';
import type { IfcModel, Revision } from '@shared/api/models';

async function uploaderNames(revisions: RevisionModel[]): Promise<Map<number, string>> {
  const ids = [...new Set(revisions.map((r) => r.uploadedById).filter((v): v is number => v != null))];
  if (!ids.length) return new Map();
  const users = await UserModel.findAll({ where: { id: ids }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, u.name]));
}

export async function presentRevisions(revisions: RevisionModel[]): Promise<Revision[]> {
  const names = await uploaderNames(revisions);
  return revisions.map((r) => presentRevision(r, r.uploadedById ? (names.get(r.uploadedById) ?? null) : null));
}

/** The project's models with their newest revision each. */
export async function listModels(projectId: number): Promise<IfcModel[]> {
  const models = await IfcModelModel.findAll({ where: { projectId }, order: [['name', 'ASC']] });
  if (!models.length) return [];
  const revisions = await RevisionModel.findAll({ where: { modelId: models.map((m) => m.id) }, order: [['number', 'DESC']] });
  const presented = await presentRevisions(revisions);
  return models.map((m) => {
    const own = presented.filter((r) => r.modelId === m.id);
    return presentModel(m, own[0] ?? null, own.length);
  });
}

export async function findModel(projectId: number, modelId: number): Promise<IfcModelModel> {
  const model = await IfcModelModel.findOne({ where: { id: modelId, projectId } });
  if (!model) throw errors.notFound('That model');
  return model;
}

/** A revision, only through a project the caller can see. */
export async function findRevision(projectId: number, revisionId: number): Promise<RevisionModel> {
  const models = await IfcModelModel.findAll({ where: { projectId }, attributes: ['id'] });
  const revision = await RevisionModel.findOne({ where: { id: revisionId, modelId: { [Op.in]: models.map((m) => m.id) } } });
  if (!revision) throw errors.notFound('That revision');
  return revision;
}

export async function listRevisions(modelId: number): Promise<Revision[]> {
  return presentRevisions(await RevisionModel.findAll({ where: { modelId }, order: [['number', 'DESC']] }));
}
