import type { Express } from 'express';
import { CHECKED_APP } from './api-contract';

/** Something the app may answer: a route's method on its path, or a middleware mounted with `use`. */
export interface Endpoint {
  /** The route's HTTP method in capitals, or `ALL` for a middleware: it sees every method under its path. */
  method: string;
  /** The full path as the app's code writes it, mount paths joined: `/api/setups/:id/upload-tokens`. */
  path: string;
  /** The middleware's function name (`<anonymous>` for an arrow function); a route's is empty. */
  handler: string;
}

/** The parts of a layer of the `router` package (Express 5's router) read here. */
interface RouterLayer {
  /** The path given to `use` or `route`: a string unless the app passed a RegExp or an array. */
  rawPath?: unknown;
  name: string;
  route?: { path: unknown; methods: Record<string, boolean | undefined> };
  handle: { length: number; stack?: RouterLayer[] };
}

/**
 * Every route and middleware of an Express 5 app, read from its router stack (`app.router.stack`)
 * and the stacks of the routers mounted in it, in the order a request meets them. Error handlers
 * (four arguments) are left out: they answer only a request that failed before them. The test
 * app's front that checks answers against the document (see api-contract.ts) is looked through.
 */
export function listEndpoints(app: Express): Endpoint[] {
  const inner = (app as Express & { [CHECKED_APP]?: Express })[CHECKED_APP] ?? app;
  return endpointsOf((inner.router as unknown as { stack: RouterLayer[] }).stack, '');
}

function endpointsOf(stack: RouterLayer[], mountPath: string): Endpoint[] {
  return stack.flatMap((layer): Endpoint[] => {
    if (layer.route) {
      const path = joinPath(mountPath, stringPath(layer.route.path));
      return Object.keys(layer.route.methods)
        .filter((method) => method !== '_all' && layer.route!.methods[method])
        .map((method) => ({ method: method.toUpperCase(), path, handler: '' }));
    }
    const path = joinPath(mountPath, stringPath(layer.rawPath));
    if (layer.handle.stack) return endpointsOf(layer.handle.stack, path);
    if (layer.handle.length === 4) return [];
    return [{ method: 'ALL', path, handler: layer.name }];
  });
}

/** A layer's path; a RegExp or an array path would need its own handling here, so it stops the listing. */
function stringPath(path: unknown): string {
  if (typeof path !== 'string') throw new Error(`A route or mount path that is not a string (${String(path)}): teach tests/support/route-list.ts to list it.`);
  return path;
}

function joinPath(mountPath: string, path: string): string {
  const joined = `${mountPath}/${path}`.replace(/\/{2,}/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

/** `METHOD path`, as the route tables of the tests name an endpoint: `GET /api/runs/:id`, `ALL /api/uploads`. */
export function endpointKey(endpoint: Endpoint): string {
  return `${endpoint.method} ${endpoint.path}`;
}
