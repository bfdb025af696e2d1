import type { Transaction } from 'sequelize';
import { RevisionModel } from '../../db/models/revision';

/**
 * Marks a revision's member results as changed, inside the transaction that changes them,
 * so in-memory copies of its member table (in this or any other app process) are dropped
 * at their next read.
 */
export async function bumpResultsVersion(revisionId: number, transaction: Transaction): Promise<void> {
  await RevisionModel.increment('resultsVersion', { by: 1, where: { id: revisionId }, transaction });
}
