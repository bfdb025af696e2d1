import type { User } from '@shared/api/users';
import type { UserModel } from '../../db/models/user';

/** The API shape of an account; never exposes the password hash. */
export function presentUser(user: UserModel): User {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    createdAt: user.createdAt.toISOString(),
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
  };
}
