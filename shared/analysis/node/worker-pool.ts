import * as path from 'node:path';
import type { Worker } from 'node:worker_threads';
import { AnalysisCancelledError } from './analysis-errors';
import { LineCount } from '../log/line-counter';
import { ByteRange, RangeReading, RangeTask } from './range-task';
import { WorkerJob, WorkerReply } from './range-worker';
import { startTypeScriptWorker } from './typescript-worker';

/** Each thread runs this file: TypeScript beside this one, or JavaScript when this one is compiled. */
const RANGE_WORKER = path.join(__dirname, `range-worker${path.extname(__filename)}`);

/**
 * A small young generation per thread: the scanner makes little garbage, and V8's default (tens of
 * MB per thread) would push the process past the 200 MB memory budget.
 */
const WORKER_LIMITS = { maxYoungGenerationSizeMb: 4 };

/** A fixed set of worker threads, each running jobs in order; kept for both passes of an analysis. */
export class WorkerPool {
  private readonly workers: Worker[];

  /** Starts `size` threads; an abort of `signal` stops them, failing the running tasks with `AnalysisCancelledError`. */
  constructor(size: number, signal?: AbortSignal) {
    this.workers = Array.from({ length: size }, () => startTypeScriptWorker(RANGE_WORKER, { resourceLimits: WORKER_LIMITS }));
    signal?.addEventListener('abort', () => void this.close(), { once: true });
  }

  /** Number of threads. */
  get size(): number {
    return this.workers.length;
  }

  /** Runs one task per worker (task i on worker i; no more tasks than workers) ; one promise per task, in task order. */
  runAll(tasks: readonly RangeTask[], onBytes: (bytes: number) => void): Promise<RangeReading>[] {
    return tasks.map((task, i) => this.run<RangeReading>(this.workers[i], { kind: 'analyse', task }, onBytes));
  }

  /** The SHA-256 (FIPS 180-4) of a whole file, taken by the last thread while the others analyse. */
  hash(path: string, size: number): Promise<string> {
    return this.run<string>(this.workers[this.workers.length - 1], { kind: 'hash', path, size }, () => undefined);
  }

  /** The lines and records of each range of a plain file, counted by the first thread. */
  countLines(path: string, size: number, ranges: ByteRange[]): Promise<LineCount[]> {
    return this.run<LineCount[]>(this.workers[0], { kind: 'count', path, size, ranges }, () => undefined);
  }

  /** Stops every thread. */
  async close(): Promise<void> {
    await Promise.all(this.workers.map((worker) => worker.terminate()));
  }

  private run<Result extends RangeReading | LineCount[] | string>(worker: Worker, job: WorkerJob, onBytes: (bytes: number) => void): Promise<Result> {
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
          resolve(reply.result as Result);
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
      worker.postMessage(job);
    });
  }
}
