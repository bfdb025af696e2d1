import { z } from 'zod';
import { ROLES } from './roles';

export const sessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

/** GET /api/session */
export const sessionResponseSchema = z.object({
  user: sessionUserSchema.nullable(),
  csrfToken: z.string(),
});
export type SessionResponse = z.infer<typeof sessionResponseSchema>;

/** POST /api/session */
export const signInRequestSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignInRequest = z.infer<typeof signInRequestSchema>;

export const PASSWORD_MIN_LENGTH = 10;
export const newPasswordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(200, 'Use at most 200 characters');

/** PUT /api/session/password */
export const changePasswordRequestSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword: newPasswordSchema,
});
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;

/** POST /api/session/password-reset — always 202, whether or not the e-mail has an account. */
export const passwordResetRequestSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
});

/** POST /api/session/password-token — choose a password from a one-time link. */
export const setPasswordWithTokenSchema = z.object({
  token: z.string().min(20, 'The link is incomplete').max(200),
  newPassword: newPasswordSchema,
});
