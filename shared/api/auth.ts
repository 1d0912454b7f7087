import type { UserDto } from './users';

/** Body of `POST /api/auth/login`. */
export interface LoginRequest {
  email: string;
  password: string;
}

/** Answer of `POST /api/auth/login`: a bearer token for the `Authorization` header. */
export interface LoginResponse {
  token: string;
  /** When the token stops working, ISO 8601. */
  expiresAt: string;
  user: UserDto;
}
