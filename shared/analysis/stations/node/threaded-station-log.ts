import * as path from 'node:path';
import type { Worker } from 'node:worker_threads';
import { OutcomeEncoding } from '../../log/column-mapping';
import { AnalysisRequestError } from '../../node/analysis-errors';
import { startTypeScriptWorker } from '../../node/typescript-worker';
import { Station } from '../station-columns';
import { StationBatch } from '../station-batch';
import { StationLogSummary } from '../station-log-reader';
import { FileDigest } from './file-digest';
import { columnBuffers, MoreRows, StationReadJob, StationReadReply } from './station-reader-thread';
import { StationLogReading } from './station-log-file';

/** The thread runs this file: TypeScript beside this one, or JavaScript when this one is compiled. */
const READER_THREAD = path.join(__dirname, `station-reader-thread${path.extname(__filename)}`);

/** The thread makes little garbage of its own: a small young generation keeps the process's memory down. */
const THREAD_LIMITS = { maxYoungGenerationSizeMb: 2 };

/** A reading of a station log file in a thread of its own, hashed there as it is read. */
export interface ThreadedStationLogReading extends StationLogReading {
  /** The file's SHA-256 and size (once `rows` has been read to its end). */
  digest(): Promise<FileDigest>;
}

/**
 * Reads a station log file in a worker thread, with its SHA-256, as `readStationLog` reads it in
 * this one (the same reader, so the same rows, problems and digest): the join reads station A's log
 * here while the thread reads station B's, on two cores. The thread sends a few batches ahead
 * (`BATCHES_AHEAD`), their columns moved rather than copied, and stops when `rows` is left early.
 */
export function readStationLogInThread(file: string, station: Station, outcomes: OutcomeEncoding): ThreadedStationLogReading {
  let end: Extract<StationReadReply, { type: 'end' }> | null = null;
  async function* rows(): AsyncGenerator<StationBatch> {
    const thread = startTypeScriptWorker(READER_THREAD, { resourceLimits: THREAD_LIMITS });
    const replies = new ReplyQueue(thread);
    try {
      thread.postMessage({ path: file, station, outcomes } satisfies StationReadJob);
      for (;;) {
        const reply = await replies.next();
        if (reply.type === 'failed') {
          throw reply.requestKind === null ? new Error(reply.message) : new AnalysisRequestError(reply.message, reply.requestKind);
        }
        if (reply.type === 'end') {
          end = reply;
          return;
        }
        const batch = StationBatch.ofColumns(reply.length, reply.columns);
        yield batch;
        thread.postMessage({ more: batch.columns } satisfies MoreRows, columnBuffers(batch.columns));
      }
    } finally {
      await thread.terminate();
    }
  }
  const ended = () => {
    if (end === null) throw new Error('the station log has not been read to its end');
    return end;
  };
  return {
    rows: rows(),
    summary: (): StationLogSummary => ended().summary,
    compression: () => end?.compression ?? null,
    digest: () => Promise.resolve(ended().digest),
  };
}

/** The thread's replies in order, each awaited in turn; an error or exit of the thread fails the next. */
class ReplyQueue {
  private readonly waiting: StationReadReply[] = [];
  private taker: ((reply: StationReadReply) => void) | null = null;
  private failure: Error | null = null;
  private failTaker: ((error: Error) => void) | null = null;

  constructor(thread: Worker) {
    thread.on('message', (reply: StationReadReply) => {
      if (this.taker === null) {
        this.waiting.push(reply);
        return;
      }
      const take = this.taker;
      this.taker = null;
      take(reply);
    });
    const fail = (error: Error) => {
      this.failure ??= error;
      this.failTaker?.(this.failure);
    };
    thread.once('error', fail);
    thread.once('exit', () => fail(new Error('the station reader thread stopped')));
  }

  next(): Promise<StationReadReply> {
    const ready = this.waiting.shift();
    if (ready !== undefined) return Promise.resolve(ready);
    if (this.failure !== null) return Promise.reject(this.failure);
    return new Promise((resolve, reject) => {
      this.taker = resolve;
      this.failTaker = reject;
    });
  }
}
