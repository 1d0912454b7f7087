import { parentPort } from 'node:worker_threads';
import { LineCount } from '../log/line-counter';
import { hashAndCount } from './counting-pass';
import { ByteRange, RangeReading, RangeTask, runRangeTask } from './range-task';

/** What a range worker is asked to do: count the lines of ranges (the counting pass), hash a whole file, or analyse a range. */
export type WorkerJob = { kind: 'count'; path: string; size: number; ranges: ByteRange[] } | { kind: 'hash'; path: string; size: number } | { kind: 'analyse'; task: RangeTask };

/** Messages from a range worker to its pool. */
export type WorkerReply = { type: 'progress'; bytes: number } | { type: 'done'; result: RangeReading | LineCount[] | string } | { type: 'failed'; message: string };

/** Progress is reported after this many bytes, to keep messages few. */
const PROGRESS_STEP = 16 * 1024 * 1024;

// Worker thread entry: runs one job per message, in order.
parentPort?.on('message', (job: WorkerJob) => void runJob(job));

async function runJob(job: WorkerJob): Promise<void> {
  const port = parentPort!;
  let unreported = 0;
  const onBytes = (bytes: number) => {
    unreported += bytes;
    if (unreported >= PROGRESS_STEP) {
      port.postMessage({ type: 'progress', bytes: unreported } satisfies WorkerReply);
      unreported = 0;
    }
  };
  try {
    const result =
      job.kind === 'count'
        ? (
            await hashAndCount(
              job.path,
              job.size,
              job.ranges,
              false,
              () => undefined,
              () => false,
            )
          ).counts
        : job.kind === 'hash'
          ? (
              await hashAndCount(
                job.path,
                job.size,
                [],
                true,
                () => undefined,
                () => false,
              )
            ).sha256
          : await runRangeTask(job.task, onBytes, () => false);
    port.postMessage({ type: 'progress', bytes: unreported } satisfies WorkerReply);
    port.postMessage({ type: 'done', result } satisfies WorkerReply);
  } catch (error) {
    port.postMessage({ type: 'failed', message: (error as Error).message } satisfies WorkerReply);
  }
}
