import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../../config/config';
import { UserModel } from '../../db/models/user';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { hashPassword } from '../../auth/passwords';
import type { MailService } from '../../mail/mail-service';
import { invitationMail, passwordResetMail } from '../../mail/templates';
import { consumeOneTimeToken, createOneTimeToken, LINK_LIFETIME_MS } from './one-time-links';

const setPasswordLink = (config: AppConfig, token: string) => `${config.publicUrl}/set-password#token=${token}`;

/** Sends an invitation with a one-time link to choose a password (in the caller's transaction). */
export async function sendInvitation(sequelize: Sequelize, config: AppConfig, mail: MailService, user: UserModel, invitedBy: string): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const token = await createOneTimeToken(user.id, 'invitation', transaction);
    const { subject, text } = invitationMail({ name: user.name, invitedBy, link: setPasswordLink(config, token), expiresHours: LINK_LIFETIME_MS.invitation / 3_600_000 });
    await mail.enqueue({ kind: 'invitation', to: [user.email], subject, text }, transaction);
  });
}

/**
 * Sends a reset link when the e-mail belongs to an active account; says nothing either
 * way, so the answer cannot be used to find out who has an account.
 */
export async function requestPasswordReset(sequelize: Sequelize, config: AppConfig, mail: MailService, email: string): Promise<void> {
  const user = await UserModel.findOne({ where: { email: email.trim().toLowerCase() } });
  if (!user || !user.active) return;
  await sequelize.transaction(async (transaction) => {
    const token = await createOneTimeToken(user.id, 'password-reset', transaction);
    const { subject, text } = passwordResetMail({ name: user.name, link: setPasswordLink(config, token), expiresMinutes: LINK_LIFETIME_MS['password-reset'] / 60_000 });
    await mail.enqueue({ kind: 'password-reset', to: [user.email], subject, text }, transaction);
  });
}

/** Sets a password from a one-time link (invitation or reset); the link then stops working. */
export async function setPasswordWithToken(sequelize: Sequelize, token: string, newPassword: string): Promise<void> {
  const passwordHash = await hashPassword(newPassword);
  await sequelize.transaction(async (transaction) => {
    const { userId, purpose } = await consumeOneTimeToken(token, transaction);
    await UserModel.update({ passwordHash }, { where: { id: userId }, transaction });
    await AuditEntryModel.create(
      { actorId: userId, projectId: null, action: purpose === 'invitation' ? 'account.invitation-accepted' : 'account.password-reset', subject: `user:${userId}`, detail: {}, reason: null },
      { transaction },
    );
  });
}
