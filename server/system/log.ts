import { AsyncLocalStorage } from 'node:async_hooks';
import fs from 'node:fs';
import path from 'node:path';
import pino, { type Logger } from 'pino';

/** The request a piece of work serves, carried through awaits, into queue jobs and out of them. */
export const requestContext = new AsyncLocalStorage<{ requestId: string }>();

/** The request id of the work in hand, if it serves one. */
export function currentRequestId(): string | undefined {
  return requestContext.getStore()?.requestId;
}

/** Levels pino knows, as BELLKEEP_LOG_LEVEL may name them. */
export const LOG_LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'] as const;

/**
 * Where structured logs go: JSON lines, one per event, each with the request id of the work it
 * belongs to. `file` appends to that file (`npm start` keeps the terminal for people and passes the
 * same file to its worker); without it, standard output (a service manager collects it).
 */
export interface LogOptions {
  level: (typeof LOG_LEVELS)[number];
  file?: string;
}

function createLog(options: LogOptions): Logger {
  if (options.file) fs.mkdirSync(path.dirname(options.file), { recursive: true });
  const destination = options.file ? pino.destination({ dest: options.file, append: true, sync: false }) : pino.destination(1);
  return pino(
    {
      level: options.level,
      base: { pid: process.pid },
      mixin: () => {
        const requestId = currentRequestId();
        return requestId ? { requestId } : {};
      },
      // Never a secret: requests are logged by method, path and id only (no headers, no bodies),
      // and these paths are blanked wherever they appear.
      redact: { paths: ['authorization', 'password', 'token', 'seed', '*.authorization', '*.password', '*.token'], censor: '[hidden]' },
    },
    destination,
  );
}

/** The process's log, from the environment until `configureLog` sets it (jest runs are quiet but for warnings). */
export let log: Logger = createLog({
  level: (process.env['BELLKEEP_LOG_LEVEL'] as LogOptions['level'] | undefined) ?? (process.env['NODE_ENV'] === 'test' ? 'warn' : 'info'),
  file: process.env['BELLKEEP_LOG_FILE'] || undefined,
});

/** Sets the process's log (once at start, from the configuration). */
export function configureLog(options: LogOptions): void {
  log = createLog(options);
}
