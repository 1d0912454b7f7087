import { z } from 'zod';
import { userSchema } from './users';

/** Body of `POST /api/auth/login`. */
export const loginRequestSchema = /* @__PURE__ */ z
  .object({
    email: z.string().trim().min(1, 'is required').max(320),
    password: z.string().min(1, 'is required').max(200),
  })
  .meta({ id: 'LoginRequest' });
export type LoginRequest = z.infer<typeof loginRequestSchema>;

/** Answer of `POST /api/auth/login`: a bearer token for the `Authorization` header. */
export const loginResponseSchema = /* @__PURE__ */ z
  .object({
    token: z.string(),
    expiresAt: z.string().meta({ description: 'When the token stops working, ISO 8601.' }),
    user: userSchema,
  })
  .meta({ id: 'LoginResponse' });
export type LoginResponse = z.infer<typeof loginResponseSchema>;
