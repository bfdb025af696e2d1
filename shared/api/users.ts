import { z } from 'zod';
import { ROLES } from './roles';
import { newPasswordSchema } from './session';

/** A person as admins see them (GET /api/users). */
export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  active: z.boolean(),
  createdAt: z.string(),
  lastSignInAt: z.string().nullable(),
});
export type User = z.infer<typeof userSchema>;
export const userListSchema = z.object({ users: z.array(userSchema) });

/** POST /api/users (admin). The password is optional: without it the account waits for an invitation link (mail arrives in a later release). */
export const createUserRequestSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  name: z.string().trim().min(1, 'Enter a name').max(120),
  role: z.enum(ROLES),
  password: newPasswordSchema.optional(),
});
export type CreateUserRequest = z.infer<typeof createUserRequestSchema>;

/** PATCH /api/users/:id (admin) */
export const updateUserRequestSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter a name').max(120).optional(),
    role: z.enum(ROLES).optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;
