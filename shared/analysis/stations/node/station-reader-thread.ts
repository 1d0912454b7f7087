import { parentPort } from 'node:worker_threads';
import { OutcomeEncoding } from '../../log/column-mapping';
import { AnalysisRequestError } from '../../node/analysis-errors';
import { Station } from '../station-columns';
import { StationColumns } from '../station-batch';
import { StationLogSummary } from '../station-log-reader';
import { DigestingSource, FileDigest } from './file-digest';
import { readStationLog } from './station-log-file';

/** What a station reader thread is asked: read one station log file, hashing it. */
export interface StationReadJob {
  path: string;
  station: Station;
  outcomes: OutcomeEncoding;
}

/** Messages of a station reader thread: a batch of rows (its columns moved, not copied), the end of the log, or a failure. */
export type StationReadReply =
  | { type: 'batch'; length: number; columns: StationColumns }
  | { type: 'end'; summary: StationLogSummary; compression: 'gzip' | 'none' | null; digest: FileDigest }
  | { type: 'failed'; message: string; requestKind: AnalysisRequestError['kind'] | null };

/** Read size of the thread's file. */
const THREAD_READ_BYTES = 1024 * 1024;

/** Batches sent ahead of the reading side: enough to keep both threads busy, few enough to keep memory flat. */
export const BATCHES_AHEAD = 2;

/** Asks for one more batch: the main thread has taken one and hands its columns back to be filled again. */
export interface MoreRows {
  more: StationColumns;
}

/** The typed arrays' buffers of columns, to move them to the other thread. */
export function columnBuffers(columns: StationColumns): ArrayBuffer[] {
  return Object.values(columns).flatMap((column: Float64Array | Uint8Array | null) => (column === null ? [] : [column.buffer as ArrayBuffer]));
}

// Worker thread entry: reads one station log per job, sending its batches as the main thread takes them.
parentPort?.on('message', (message: StationReadJob | MoreRows) => {
  if ('more' in message) {
    returned.push(message.more);
    wake?.();
  } else {
    void read(message);
  }
});

/** Columns the main thread has handed back, to fill again: batches in flight stay at `BATCHES_AHEAD`. */
const returned: StationColumns[] = [];
let sent = 0;
let wake: (() => void) | null = null;

async function read(job: StationReadJob): Promise<void> {
  const port = parentPort!;
  try {
    // Smaller reads than the engine's own: this thread only parses, and memory is shared with the main thread's reading.
    const digesting = new DigestingSource({ path: job.path, readBytes: THREAD_READ_BYTES });
    const reading = readStationLog(digesting.tapped, job.station, job.outcomes);
    for await (const batch of reading.rows) {
      while (sent >= BATCHES_AHEAD && returned.length === 0) await new Promise<void>((resolve) => (wake = resolve));
      const columns = batch.copyInto(sent < BATCHES_AHEAD ? null : returned.pop()!);
      sent = Math.min(sent + 1, BATCHES_AHEAD);
      port.postMessage({ type: 'batch', length: batch.length, columns } satisfies StationReadReply, columnBuffers(columns));
    }
    const digest = await digesting.digest();
    port.postMessage({ type: 'end', summary: reading.summary(), compression: reading.compression(), digest } satisfies StationReadReply);
  } catch (error) {
    const requestKind = error instanceof AnalysisRequestError ? error.kind : null;
    port.postMessage({ type: 'failed', message: (error as Error).message, requestKind } satisfies StationReadReply);
  }
}
