import type { Role } from './roles';

/** A user as the API returns it: never the password hash. */
export interface UserDto {
  id: number;
  email: string;
  name: string;
  roles: Role[];
  /** Whether the user may sign in; a deactivated user's tokens stop working at once. */
  active: boolean;
  createdAt: string;
}

/** Body of `POST /api/users` (admin). */
export interface CreateUserRequest {
  email: string;
  name: string;
  password: string;
  roles: Role[];
}

/** Body of `PATCH /api/users/:id` (admin): each field optional, at least one given. */
export interface UpdateUserRequest {
  name?: string;
  roles?: Role[];
  active?: boolean;
}

/** Shortest password an admin may set (common practice, no source). */
export const MIN_PASSWORD_LENGTH = 10;
