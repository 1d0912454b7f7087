import { z } from 'zod';
import { createUserRequestSchema, loginRequestSchema, loginResponseSchema, updateUserRequestSchema, userSchema } from '@shared/api';
import type { Operation } from './operation';

/** Signing in and the people of the lab. */
export const PEOPLE_OPERATIONS: Operation[] = [
  {
    method: 'post',
    path: '/api/auth/login',
    summary: 'Sign in',
    description: 'Answers a bearer token (a JWT) for the `Authorization: Bearer …` header of every other call. Limited per client address and per account.',
    tags: ['Signing in'],
    access: 'public',
    body: loginRequestSchema,
    response: loginResponseSchema,
    errors: { 401: 'The e-mail or the password is wrong, or the account is deactivated.', 429: 'Too many sign-ins from this address or for this account; wait.' },
  },
  { method: 'get', path: '/api/auth/me', summary: 'Who the token belongs to', tags: ['Signing in'], access: 'signed-in', response: userSchema },
  { method: 'get', path: '/api/users', summary: 'List the users', tags: ['Users'], access: ['admin'], response: z.array(userSchema) },
  {
    method: 'post',
    path: '/api/users',
    summary: 'Make a user',
    description: 'The new user gets a welcome mail.',
    tags: ['Users'],
    access: ['admin'],
    body: createUserRequestSchema,
    status: 201,
    response: userSchema,
    errors: { 409: 'A user with this e-mail exists.' },
  },
  {
    method: 'patch',
    path: '/api/users/{id}',
    summary: "Change a user's name, e-mail, roles or whether they may sign in",
    tags: ['Users'],
    access: ['admin'],
    body: updateUserRequestSchema,
    response: userSchema,
    errors: { 404: 'No such user.', 409: 'Another user has that e-mail, or an admin would remove their own admin role or deactivate themselves.' },
  },
];
