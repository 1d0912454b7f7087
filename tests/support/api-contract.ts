import Ajv2020, { type ValidateFunction } from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import type { Express } from 'express';
import request, { type Response } from 'supertest';
import { buildApiDocument } from '../../server/openapi/api-document';
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

/** The template of a request path: `/api/runs/7/export/json` → `/api/runs/{id}/export/{format}`, or undefined. */
function templateOf(method: string, url: string): string | undefined {
  const path = new URL(url, 'http://bellkeep.test').pathname;
  const paths = Object.entries(API_DOCUMENT.paths ?? {}).filter(([, item]) => method.toLowerCase() in (item as object));
  return paths.map(([template]) => template).find((template) => new RegExp(`^${template.replace(/\{\w+\}/g, '[^/]+')}$`).test(path));
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

  return {
    /** Problems of one answer with the document: none when it fits. */
    problemsOf(method: string, url: string, response: Response): string[] {
      const template = templateOf(method, url);
      if (!template) return [`${method} ${url}: no such operation in the document`];
      const operation = (API_DOCUMENT.paths as Record<string, Operations>)[template][method.toLowerCase()];
      const documented = operation.responses[String(response.status)];
      if (!documented) return [`${method} ${template}: status ${response.status} is not documented`];
      checked.add(`${method.toUpperCase()} ${template} ${response.status}`);
      if (!documented.content?.['application/json']?.schema || !response.type.includes('json')) return [];
      const validate = validatorOf(template, method.toLowerCase(), String(response.status));
      if (validate(response.body)) return [];
      return (validate.errors ?? []).map((error) => `${method} ${template} ${response.status}: ${error.instancePath || '(body)'} ${error.message}`);
    },
    /** The `METHOD /template status` answers checked so far. */
    checked,
  };
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
