import { UserModel } from '../../db/models/user';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { hashPassword, verifyPassword } from '../../auth/passwords';
import { errors } from '../../http/errors';

export async function recordSignIn(userId: number): Promise<void> {
  await UserModel.update({ lastSignInAt: new Date() }, { where: { id: userId } });
}

/** Changes a password after checking the current one; audited. */
export async function changePassword(userId: number, currentPassword: string, newPassword: string): Promise<void> {
  const user = await UserModel.findByPk(userId);
  if (!user?.passwordHash || !(await verifyPassword(currentPassword, user.passwordHash))) {
    throw errors.validation('The current password is not correct.', { currentPassword: 'The current password is not correct.' });
  }
  if (currentPassword === newPassword) {
    throw errors.validation('Choose a password different from the current one.', { newPassword: 'Choose a different password.' });
  }
  user.passwordHash = await hashPassword(newPassword);
  await user.save();
  await AuditEntryModel.create({ actorId: userId, projectId: null, action: 'account.password-changed', subject: `user:${userId}`, detail: {}, reason: null });
}
