import { parentPort } from 'node:worker_threads';
import { RangeSummary } from '../log/range-analysis';
import { RangeTask, runRangeTask } from './range-task';

/** Messages from a range worker to its pool. */
export type WorkerReply =
  | { type: 'progress'; bytes: number }
  | { type: 'done'; result: RangeSummary }
  | { type: 'failed'; message: string };

/** Progress is reported after this many bytes, to keep messages few. */
const PROGRESS_STEP = 16 * 1024 * 1024;

// Worker thread entry: runs one range task per message, in order.
parentPort?.on('message', async (task: RangeTask) => {
  const port = parentPort!;
  let unreported = 0;
  try {
    const result = await runRangeTask(
      task,
      (bytes) => {
        unreported += bytes;
        if (unreported >= PROGRESS_STEP) {
          port.postMessage({ type: 'progress', bytes: unreported } satisfies WorkerReply);
          unreported = 0;
        }
      },
      () => false,
    );
    port.postMessage({ type: 'progress', bytes: unreported } satisfies WorkerReply);
    port.postMessage({ type: 'done', result } satisfies WorkerReply);
  } catch (error) {
    port.postMessage({ type: 'failed', message: (error as Error).message } satisfies WorkerReply);
  }
});
