import { z } from 'zod';
import { ROLES } from './roles';

/** A user as the API returns it: never the password hash. */
export const userSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    email: z.string(),
    name: z.string(),
    roles: z.array(z.enum(ROLES)),
    active: z.boolean().meta({ description: "Whether the user may sign in; a deactivated user's tokens stop working at once." }),
    createdAt: z.string(),
  })
  .meta({ id: 'UserDto' });
export type UserDto = z.infer<typeof userSchema>;

/** Shortest password an admin may set (common practice, no source). */
export const MIN_PASSWORD_LENGTH = 10;

const newPassword = /* @__PURE__ */ z.string().min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`).max(200);
const rolesField = /* @__PURE__ */ z.array(z.enum(ROLES)).min(1, 'needs at least one role');
const personName = /* @__PURE__ */ z.string().trim().min(1, 'is required').max(200);
const emailField = /* @__PURE__ */ z.string().trim().max(320).pipe(z.email('is not an e-mail address'));

/** Body of `POST /api/users` (admin). */
export const createUserRequestSchema = /* @__PURE__ */ z
  .strictObject({
    email: emailField,
    name: personName,
    password: newPassword,
    roles: rolesField,
  })
  .meta({ id: 'CreateUserRequest' });
export type CreateUserRequest = z.infer<typeof createUserRequestSchema>;

/** Body of `PATCH /api/users/:id` (admin): each field optional, at least one given. */
export const updateUserRequestSchema = /* @__PURE__ */ z
  .strictObject({ name: personName.optional(), email: emailField.optional(), roles: rolesField.optional(), active: z.boolean().optional() })
  .refine((body) => Object.keys(body).length > 0, 'give at least one of name, email, roles, active')
  .meta({ id: 'UpdateUserRequest' });
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;

/** Body of `POST /api/auth/password`: the signed-in user changes their own password. */
export const changePasswordRequestSchema = /* @__PURE__ */ z
  .strictObject({ currentPassword: z.string().min(1, 'is required').max(200), newPassword })
  .meta({ id: 'ChangePasswordRequest' });
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;

/** Hours a mailed reset link stays usable (common practice, no source). */
export const RESET_LINK_HOURS = 24;

/** Answer of `POST /api/users/:id/password-reset-link` (admin): where the single-use link went and until when it works. */
export const passwordResetLinkSchema = /* @__PURE__ */ z.object({ sentTo: z.string(), expiresAt: z.string() }).meta({ id: 'PasswordResetLinkDto' });
export type PasswordResetLinkDto = z.infer<typeof passwordResetLinkSchema>;

/** Body of `POST /api/auth/password-reset`: the secret of a mailed link and the new password. */
export const resetPasswordRequestSchema = /* @__PURE__ */ z
  .strictObject({ secret: z.string().regex(/^[0-9a-f]{64}$/, 'is not the secret of a reset link'), newPassword })
  .meta({ id: 'ResetPasswordRequest' });
export type ResetPasswordRequest = z.infer<typeof resetPasswordRequestSchema>;
