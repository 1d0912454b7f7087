import { Worker, type WorkerOptions } from 'node:worker_threads';

/**
 * A worker thread running a TypeScript file, or its compiled JavaScript (a `.js` file, started as
 * it is). For TypeScript the thread first installs tsx's CommonJS hook (the `--import tsx` loader
 * hooks do not reach worker threads on Node 20), then loads the file.
 */
export function startTypeScriptWorker(file: string, options: Omit<WorkerOptions, 'eval'> = {}): Worker {
  if (file.endsWith('.js')) {
    return new Worker(file, options);
  }
  const bootstrap = `require(${JSON.stringify(require.resolve('tsx/cjs'))}); require(${JSON.stringify(file)});`;
  return new Worker(bootstrap, { ...options, eval: true });
}
