/** How an analysis worker stands, from its record and heartbeat. */
export const WORKER_CONDITIONS = ['taking-jobs', 'silent', 'stopped', 'ended-unasked'] as const;
export type WorkerCondition = (typeof WORKER_CONDITIONS)[number];

/** A worker is silent once it missed this many heartbeats (WORKER_HEARTBEAT_SECONDS each). */
export const WORKER_SILENT_AFTER_BEATS = 3;

/** Unasked ends within an hour from which a worker "keeps dying". */
export const WORKER_DYING_ENDS_PER_HOUR = 3;

/** One analysis-worker process, `GET /api/workers`. */
export interface WorkerDto {
  id: string;
  /** `host:pid`, as runs name the worker that analysed them. */
  name: string;
  startedAt: string;
  seenAt: string;
  endedAt: string | null;
  /** How it ended, in words ("stopped when asked", "killed (SIGKILL)", "exit code 1"). */
  endedHow: string | null;
  condition: WorkerCondition;
}

/** The admins' view of the analysis workers: who takes jobs, who died, what waits. */
export interface WorkersOverviewDto {
  /** Workers that started in the last 24 hours, or still run, newest first. */
  workers: WorkerDto[];
  takingJobs: number;
  /** Workers that ended without being asked to, or went silent, in the last hour. */
  lostInLastHour: number;
  /** Runs waiting for a worker (queued, or analysing with a silent worker). */
  waitingRuns: number;
  /** A sentence for the admins when something needs them (a worker keeps dying, none takes jobs), else null. */
  attention: string | null;
}

/** One part's answer to `GET /api/ready`. */
export interface ReadinessCheckDto {
  part: string;
  ready: boolean;
  /** Why it is not ready, in one line; null when it is. */
  problem: string | null;
}

/** `GET /api/ready`: 200 when every part answers, 503 naming the one that does not. */
export interface ReadinessDto {
  status: 'ready' | 'not-ready';
  checks: ReadinessCheckDto[];
}
