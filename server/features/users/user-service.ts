import { UniqueConstraintError, type Sequelize } from 'sequelize';
import type { CreateUserRequest, UpdateUserRequest } from '@shared/api/users';
import { UserModel } from '../../db/models/user';
import { AuditEntryModel } from '../../db/models/audit-entry';
import { hashPassword } from '../../auth/passwords';
import { errors } from '../../http/errors';

export async function listUsers(): Promise<UserModel[]> {
  return UserModel.findAll({ order: [['name', 'ASC']] });
}

export async function createUser(sequelize: Sequelize, actorId: number, input: CreateUserRequest): Promise<UserModel> {
  const passwordHash = input.password ? await hashPassword(input.password) : null;
  try {
    return await sequelize.transaction(async (transaction) => {
      const user = await UserModel.create(
        { email: input.email, name: input.name, role: input.role, passwordHash, lastSignInAt: null },
        { transaction },
      );
      await AuditEntryModel.create(
        { actorId, projectId: null, action: 'account.created', subject: `user:${user.id}`, detail: { email: user.email, role: user.role }, reason: null },
        { transaction },
      );
      return user;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw errors.conflict(`An account for ${input.email} already exists.`);
    throw err;
  }
}

export async function updateUser(sequelize: Sequelize, actorId: number, userId: number, input: UpdateUserRequest): Promise<UserModel> {
  return sequelize.transaction(async (transaction) => {
    const user = await UserModel.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw errors.notFound('That person');
    // An admin cannot lock themselves out: the last way back in would be the database.
    if (user.id === actorId && (input.active === false || (input.role && input.role !== 'admin'))) {
      throw errors.validation('You cannot deactivate yourself or remove your own admin role.');
    }
    const before = { name: user.name, role: user.role, active: user.active };
    user.set(input);
    await user.save({ transaction });
    await AuditEntryModel.create(
      { actorId, projectId: null, action: 'account.updated', subject: `user:${user.id}`, detail: { before, after: input }, reason: null },
      { transaction },
    );
    return user;
  });
}
