import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import { AnalysisCancelledError } from './analysis-errors';
import { RangeTask, RangeTaskResult } from './range-task';
import { WorkerReply } from './range-worker';

/**
 * The worker file is TypeScript: each thread first installs tsx's CommonJS hook (the `--import tsx`
 * loader hooks do not reach worker threads on Node 20), then loads it.
 */
const BOOTSTRAP = `require(${JSON.stringify(require.resolve('tsx/cjs'))}); require(${JSON.stringify(path.join(__dirname, 'range-worker.ts'))});`;

/** A fixed set of worker threads, each running range tasks in order; kept for both passes of an analysis. */
export class WorkerPool {
  private readonly workers: Worker[];

  /** Starts `size` threads; an abort of `signal` stops them, failing the running tasks with `AnalysisCancelledError`. */
  constructor(size: number, signal?: AbortSignal) {
    this.workers = Array.from({ length: size }, () => new Worker(BOOTSTRAP, { eval: true }));
    signal?.addEventListener('abort', () => void this.close(), { once: true });
  }

  /** Number of threads. */
  get size(): number {
    return this.workers.length;
  }

  /** Runs one task per worker (task i on worker i; no more tasks than workers) and collects the results in task order. */
  runAll(tasks: readonly RangeTask[], onBytes: (bytes: number) => void): Promise<RangeTaskResult[]> {
    return Promise.all(tasks.map((task, i) => this.run(this.workers[i], task, onBytes)));
  }

  /** Stops every thread. */
  async close(): Promise<void> {
    await Promise.all(this.workers.map((worker) => worker.terminate()));
  }

  private run(worker: Worker, task: RangeTask, onBytes: (bytes: number) => void): Promise<RangeTaskResult> {
    return new Promise((resolve, reject) => {
      const settle = () => {
        worker.off('message', onMessage);
        worker.off('error', onError);
        worker.off('exit', onExit);
      };
      const onMessage = (reply: WorkerReply) => {
        if (reply.type === 'progress') {
          onBytes(reply.bytes);
          return;
        }
        settle();
        if (reply.type === 'done') {
          resolve(reply.result);
        } else {
          reject(new Error(reply.message));
        }
      };
      const onError = (error: Error) => {
        settle();
        reject(error);
      };
      const onExit = () => {
        settle();
        reject(new AnalysisCancelledError());
      };
      worker.on('message', onMessage);
      worker.once('error', onError);
      worker.once('exit', onExit);
      worker.postMessage(task);
    });
  }
}
