import { WORKER_HEARTBEAT_SECONDS, WORKER_SILENT_AFTER_BEATS, type RunDto } from '@shared/api';
import { shownDate } from '../dates/shown-dates';

/** A queued run is overdue for a worker after this long. */
const QUEUED_OVERDUE_MS = 20_000;
/** A worker missing a few heartbeats in a row is taken for gone. */
const SILENT_AFTER_MS = WORKER_SILENT_AFTER_BEATS * WORKER_HEARTBEAT_SECONDS * 1000;

/** A time of day with its zone, as every time on screen. */
const clock = (iso: string) => shownDate(iso, 'time');

/**
 * Why a pending run is still waiting, when it waits for a worker rather than on one: nobody took
 * it, or the worker analysing it went silent. Null while all is well (or the run is finished).
 */
export function workerWait(run: Pick<RunDto, 'state' | 'createdAt' | 'heartbeatAt' | 'analysedBy'>, now: number): string | null {
  if (run.state === 'queued' && now - Date.parse(run.createdAt) > QUEUED_OVERDUE_MS) {
    return `No analysis worker has taken this run since ${clock(run.createdAt)}. Is a worker running? npm start runs one; a machine of its own runs npm run worker.`;
  }
  if (run.state === 'analysing' && run.heartbeatAt !== null && now - Date.parse(run.heartbeatAt) > SILENT_AFTER_MS) {
    return `Waiting for a worker: ${run.analysedBy ?? 'the worker analysing this run'} has not been heard from since ${clock(run.heartbeatAt)}. If it stopped, the queue hands the run to another worker once the analysis time limit has passed; nothing is lost.`;
  }
  return null;
}
