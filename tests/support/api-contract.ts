import Ajv2020, { type ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import express, { type Express } from 'express';
import request, { type Response } from 'supertest';
import { buildApiDocument } from '@server/openapi/api-document';
import type { Endpoint } from './route-list';

/** The API's OpenAPI document, as served at /api/openapi.json. */
export const API_DOCUMENT = buildApiDocument();

type Operations = Record<string, { responses: Record<string, { content?: Record<string, { schema?: unknown }> }> }>;

/** Express's `/api/runs/:id` in OpenAPI's form, `/api/runs/{id}`. */
export function openApiPath(expressPath: string): string {
  return expressPath.replace(/:(\w+)/g, '{$1}');
}

/** The document's operations as `METHOD /path/{param}`. */
export function documentedOperations(): string[] {
  return Object.entries(API_DOCUMENT.paths ?? {}).flatMap(([path, item]) =>
    Object.keys(item as object)
      .filter((key) => ['get', 'post', 'put', 'patch', 'delete', 'head', 'options'].includes(key))
      .map((method) => `${method.toUpperCase()} ${path}`),
  );
}

/** Whether the endpoint (a route, or a middleware that sees every method under its path) answers the documented operation. */
export function endpointAnswers(endpoint: Endpoint, operation: string): boolean {
  const [method, path] = operation.split(' ');
  const endpointPath = openApiPath(endpoint.path);
  if (endpoint.method === 'ALL') return path === endpointPath || path.startsWith(`${endpointPath}/`);
  return endpoint.method === method && endpointPath === path;
}

/**
 * The template of a request path: `/api/runs/7/export/json` → `/api/runs/{id}/export/{format}`, or
 * undefined. A literal path wins over a template it also fits (`/api/runs/station-logs` over `/api/runs/{id}`), as Express routes it.
 */
function templateOf(method: string, url: string): string | undefined {
  const path = new URL(url, 'http://bellkeep.test').pathname;
  const paths = Object.entries(API_DOCUMENT.paths ?? {}).filter(([, item]) => method.toLowerCase() in (item as object));
  const fitting = paths.map(([template]) => template).filter((template) => new RegExp(`^${template.replace(/\{\w+\}/g, '[^/]+')}$`).test(path));
  return fitting.find((template) => template === path) ?? fitting[0];
}

/**
 * Checks answers against the document with ajv's JSON Schema 2020-12 (the dialect of OpenAPI
 * 3.1): the status must be documented for the operation, and a JSON body must fit its schema.
 */
export function createContractChecker() {
  const ajv = new Ajv2020({ strict: false, allErrors: true });
  addFormats(ajv);
  ajv.addSchema(API_DOCUMENT, 'bellkeep-api');
  const validators = new Map<string, ValidateFunction>();
  const checked = new Set<string>();

  /** The schema of an operation's answer in ajv, by JSON pointer into the document (refs resolve there). */
  function validatorOf(template: string, method: string, status: string): ValidateFunction {
    const pointer = ['paths', template, method, 'responses', status, 'content', 'application/json', 'schema']
      .map((part) => part.replaceAll('~', '~0').replaceAll('/', '~1'))
      .join('/');
    const key = `bellkeep-api#/${pointer}`;
    if (!validators.has(key)) validators.set(key, ajv.compile({ $ref: key }));
    return validators.get(key)!;
  }

  /** Problems of one answer (its status, and its body when `json`) with the document: none when it fits. */
  function problemsOfAnswer(method: string, url: string, status: number, json: { body: unknown } | null): string[] {
    const template = templateOf(method, url);
    if (!template) return [`${method} ${url}: no such operation in the document`];
    const operation = (API_DOCUMENT.paths as Record<string, Operations>)[template][method.toLowerCase()];
    const documented = operation.responses[String(status)];
    if (!documented) return [`${method} ${template}: status ${status} is not documented`];
    checked.add(`${method.toUpperCase()} ${template} ${status}`);
    if (!documented.content?.['application/json']?.schema || json === null) return [];
    const validate = validatorOf(template, method.toLowerCase(), String(status));
    if (validate(json.body)) return [];
    return (validate.errors ?? []).map((error) => `${method} ${template} ${status}: ${error.instancePath || '(body)'} ${error.message}`);
  }

  return {
    problemsOfAnswer,
    /** Whether the document has an operation for this method and path. */
    knows: (method: string, url: string) => templateOf(method, url) !== undefined,
    /** Problems of one supertest answer with the document: none when it fits. */
    problemsOf(method: string, url: string, response: Response): string[] {
      return problemsOfAnswer(method, url, response.status, response.type.includes('json') ? { body: response.body } : null);
    },
    /** The `METHOD /template status` answers checked so far. */
    checked,
  };
}

/** Where the front of `contractRecordingApp` keeps the app it checks (route listings look through it). */
export const CHECKED_APP = Symbol('the app behind the contract check');

/**
 * The app behind a front that checks every answer under /api (its status, and its body when it is
 * JSON) against the document as it goes out, keeping the misfits: the API tests run through it, so
 * whatever they provoke must be documented. /api/reference (the page) and the document itself are
 * not operations.
 */
export function contractRecordingApp(app: Express, checker: ReturnType<typeof createContractChecker>): { app: Express; misfits: string[] } {
  const front = Object.assign(express(), { [CHECKED_APP]: app });
  const misfits: string[] = [];
  front.use((request, response, next) => {
    const url = request.originalUrl;
    // OPTIONS is Express's own answer (the Allow header), not an operation of the API.
    if (!url.startsWith('/api/') || url.startsWith('/api/reference') || url.startsWith('/api/openapi.json') || request.method === 'OPTIONS') return next();
    // HEAD is answered as GET, without the body, wherever no HEAD operation of its own is documented.
    const method = request.method === 'HEAD' && !checker.knows('HEAD', url) ? 'GET' : request.method;
    let json: { body: unknown } | null = null;
    const send = response.json.bind(response);
    response.json = (body: unknown) => {
      json = { body };
      return send(body);
    };
    response.on('finish', () => {
      // 304: a browser's conditional GET answered from its cache (HTTP's, not an operation's).
      if (response.statusCode === 304) return;
      // A method or path the API does not have is refused (401 before the guard, 404 from the
      // catch-all): no operation to check against. Answered with success, it would be one the document lacks.
      const refusedUnknown = response.statusCode >= 400 && !checker.knows(method, url);
      if (!refusedUnknown) misfits.push(...checker.problemsOfAnswer(method, url, response.statusCode, json));
    });
    next();
  });
  front.use(app);
  return { app: front, misfits };
}

/** supertest on the app, each answer checked against the document (a misfit fails the request's test). */
export function contractCheckedRequest(app: Express, checker: ReturnType<typeof createContractChecker>) {
  const call = (method: 'get' | 'post' | 'put' | 'patch' | 'head') => (url: string) =>
    request(app)
      [method](url)
      .expect((response) => {
        const problems = checker.problemsOf(method, url, response);
        if (problems.length > 0) throw new Error(problems.join('\n'));
      });
  return { get: call('get'), post: call('post'), put: call('put'), patch: call('patch'), head: call('head') };
}
