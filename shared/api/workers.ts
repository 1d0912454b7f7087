import { z } from 'zod';

/** How an analysis worker stands, from its record and heartbeat. */
export const WORKER_CONDITIONS = ['taking-jobs', 'silent', 'stopped', 'ended-unasked'] as const;
export type WorkerCondition = (typeof WORKER_CONDITIONS)[number];

/** A worker is silent once it missed this many heartbeats (WORKER_HEARTBEAT_SECONDS each). */
export const WORKER_SILENT_AFTER_BEATS = 3;

/** Unasked ends within an hour from which a worker "keeps dying". */
export const WORKER_DYING_ENDS_PER_HOUR = 3;

/** One analysis-worker process, `GET /api/workers`. */
export const workerSchema = /* @__PURE__ */ z
  .object({
    id: z.string(),
    name: z.string().meta({ description: '`host:pid`, as runs name the worker that analysed them.' }),
    startedAt: z.string(),
    seenAt: z.string(),
    endedAt: z.string().nullable(),
    endedHow: z.string().nullable().meta({ description: 'How it ended, in words ("stopped when asked", "killed (SIGKILL)", "exit code 1").' }),
    condition: z.enum(WORKER_CONDITIONS),
  })
  .meta({ id: 'WorkerDto' });
export type WorkerDto = z.infer<typeof workerSchema>;

/** The admins' view of the analysis workers: who takes jobs, who died, what waits. */
export const workersOverviewSchema = /* @__PURE__ */ z
  .object({
    workers: z.array(workerSchema).meta({ description: 'Workers that started in the last 24 hours, or still run, newest first.' }),
    takingJobs: z.number().int(),
    lostInLastHour: z.number().int().meta({ description: 'Workers that ended without being asked to, or went silent, in the last hour.' }),
    waitingRuns: z.number().int().meta({ description: 'Runs waiting for a worker (queued, or analysing with a silent worker).' }),
    attention: z.string().nullable().meta({ description: 'A sentence for the admins when something needs them (a worker keeps dying, none takes jobs), else null.' }),
  })
  .meta({ id: 'WorkersOverviewDto' });
export type WorkersOverviewDto = z.infer<typeof workersOverviewSchema>;

/** One part's answer to `GET /api/ready`. */
export const readinessCheckSchema = /* @__PURE__ */ z
  .object({ part: z.string(), ready: z.boolean(), problem: z.string().nullable().meta({ description: 'Why it is not ready, in one line; null when it is.' }) })
  .meta({ id: 'ReadinessCheckDto' });
export type ReadinessCheckDto = z.infer<typeof readinessCheckSchema>;

/** `GET /api/ready`: 200 when every part answers, 503 naming the one that does not. */
export const readinessSchema = /* @__PURE__ */ z.object({ status: z.enum(['ready', 'not-ready']), checks: z.array(readinessCheckSchema) }).meta({ id: 'ReadinessDto' });
export type ReadinessDto = z.infer<typeof readinessSchema>;

/** `GET /api/health`: the process lives. */
export const healthSchema = /* @__PURE__ */ z.object({ status: z.literal('ok') }).meta({ id: 'HealthDto' });
