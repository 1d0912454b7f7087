import type { OpenAPIRegistry, ResponseConfig, RouteConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { apiErrorBodySchema, type Role } from '@shared/api';

/**
 * Who may call an operation: anyone; anyone signed in; people holding one of the roles; or, for
 * the upload routes, an experimentalist or an upload token of the setup.
 */
export type Access = 'public' | 'signed-in' | 'uploader' | readonly Role[];

export interface Operation {
  method: RouteConfig['method'];
  /** OpenAPI's form: `/api/runs/{id}`. */
  path: string;
  summary: string;
  description?: string;
  tags: string[];
  access: Access;
  query?: z.ZodObject;
  body?: z.ZodType;
  /** The body's media type: JSON unless said. */
  bodyType?: 'application/json' | 'multipart/form-data';
  /** Request headers the operation reads, each with what it does. */
  headers?: z.ZodObject;
  /** The success answer's status (200 unless said) and body: a schema, or a media type with a description. */
  status?: number;
  response?: z.ZodType;
  media?: { type: string; description: string };
  /** Other success answers, e.g. the last PATCH of a resumable upload. */
  alsoAnswers?: { status: number; description: string; response?: z.ZodType }[];
  /** The error statuses the operation answers besides the access refusals, each with its reason. */
  errors?: Record<number, string>;
}

/** The refusals an operation's access brings: 401 without a valid token, 403 without a role it needs. */
function accessErrors(access: Access): Record<number, string> {
  if (access === 'public') return {};
  const unauthorized = { 401: 'No valid token: missing, expired, forged, revoked, or of a deactivated person.' };
  return access === 'signed-in' ? unauthorized : { ...unauthorized, 403: 'Signed in, but holding none of the roles this operation needs.' };
}

/** The roles' words in the operation's description and in its `x-bellkeep-access` field. */
function accessWords(access: Access): string {
  if (access === 'public') return 'Public: no sign-in.';
  if (access === 'signed-in') return 'Anyone signed in (any role).';
  if (access === 'uploader') return 'An experimentalist signed in, or an upload token (`bkup_…`) of the setup the log is for.';
  return `Roles: ${access.join(', ')}.`;
}

function securityOf(access: Access): RouteConfig['security'] {
  if (access === 'public') return [];
  if (access === 'uploader') return [{ signIn: [] }, { uploadToken: [] }];
  return [{ signIn: [] }];
}

const jsonAnswer = (description: string, schema?: z.ZodType): ResponseConfig => (schema ? { description, content: { 'application/json': { schema } } } : { description });
const errorResponse = (description: string): ResponseConfig => jsonAnswer(description, apiErrorBodySchema);

/** Registers one operation with its access, its parameters and every answer's body. */
export function registerOperation(registry: OpenAPIRegistry, operation: Operation): void {
  const pathParameters = [...operation.path.matchAll(/\{(\w+)\}/g)].map((match) => match[1]);
  const params =
    pathParameters.length > 0
      ? z.object(Object.fromEntries(pathParameters.map((name) => [name, /^(id|\w+Id)$/.test(name) ? z.string().regex(/^[1-9]\d*$/) : z.string()])))
      : undefined;
  const status = operation.status ?? 200;
  const success: ResponseConfig = operation.media
    ? { description: operation.media.description, content: { [operation.media.type]: { schema: { type: 'string' } } } }
    : jsonAnswer('Success.', operation.response);
  const invalid: Record<number, string> = operation.body || operation.query || params ? { 400: 'A field or parameter is not valid; `field` names it.' } : {};
  const errors: Record<number, string> = {
    ...invalid,
    ...accessErrors(operation.access),
    ...operation.errors,
    500: 'A fault of the server; it is logged with the request id (`X-Request-Id`).',
  };
  registry.registerPath({
    method: operation.method,
    path: operation.path,
    summary: operation.summary,
    description: [operation.description, accessWords(operation.access)].filter(Boolean).join('\n\n'),
    tags: operation.tags,
    security: securityOf(operation.access),
    'x-bellkeep-access': operation.access,
    request: {
      ...(params && { params }),
      ...(operation.query && { query: operation.query }),
      ...(operation.headers && { headers: operation.headers }),
      ...(operation.body && { body: { required: true, content: { [operation.bodyType ?? 'application/json']: { schema: operation.body } } } }),
    },
    responses: {
      [status]: success,
      ...Object.fromEntries((operation.alsoAnswers ?? []).map((answer) => [answer.status, jsonAnswer(answer.description, answer.response)])),
      ...Object.fromEntries(Object.entries(errors).map(([code, reason]) => [code, errorResponse(reason)])),
    },
  });
}
