import { createHash, randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { OneTimeTokenModel, type TokenPurpose } from '../../db/models/one-time-token';
import { AppError } from '../../http/errors';

const hash = (token: string) => createHash('sha256').update(token).digest('hex');

export const LINK_LIFETIME_MS: Record<TokenPurpose, number> = {
  invitation: 7 * 24 * 3_600_000,
  'password-reset': 60 * 60_000,
};

/** Makes a one-time token for a user; earlier unused tokens for the same purpose stop working. */
export async function createOneTimeToken(userId: number, purpose: TokenPurpose, transaction?: Transaction): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await OneTimeTokenModel.update({ usedAt: new Date() }, { where: { userId, purpose, usedAt: null }, transaction });
  await OneTimeTokenModel.create({ userId, purpose, tokenHash: hash(token), expiresAt: new Date(Date.now() + LINK_LIFETIME_MS[purpose]) }, { transaction });
  return token;
}

/** Uses a token once; unknown, used and expired tokens all get the same answer. */
export async function consumeOneTimeToken(token: string, transaction: Transaction): Promise<{ userId: number; purpose: TokenPurpose }> {
  const row = await OneTimeTokenModel.findOne({
    where: { tokenHash: hash(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (!row) throw new AppError(400, 'token.invalid', 'This link is not valid any more: it was used already or has expired. Ask for a new one.');
  await row.update({ usedAt: new Date() }, { transaction });
  return { userId: row.userId, purpose: row.purpose };
}
