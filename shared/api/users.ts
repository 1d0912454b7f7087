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

const rolesField = /* @__PURE__ */ z.array(z.enum(ROLES)).min(1, 'needs at least one role');
const personName = /* @__PURE__ */ z.string().trim().min(1, 'is required').max(200);
const emailField = /* @__PURE__ */ z.string().trim().max(320).pipe(z.email('is not an e-mail address'));

/** Body of `POST /api/users` (admin). */
export const createUserRequestSchema = /* @__PURE__ */ z
  .strictObject({
    email: emailField,
    name: personName,
    password: z.string().min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`).max(200),
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
