import crypto from 'node:crypto';
import os from 'node:os';
import { Op } from 'sequelize';
import { WORKER_DYING_ENDS_PER_HOUR, WORKER_HEARTBEAT_SECONDS, WORKER_SILENT_AFTER_BEATS, type WorkerCondition, type WorkerDto, type WorkersOverviewDto } from '@shared/api';
import type { Models } from '../database/models';
import type { WorkerRecord } from './worker-record.model';

const SILENT_AFTER_MS = WORKER_SILENT_AFTER_BEATS * WORKER_HEARTBEAT_SECONDS * 1000;
const HOUR_MS = 3_600_000;
const SHOWN_WORKERS = 100;

/** This process's record as a worker: beats while it takes jobs, and says so when it stops. */
export interface WorkerPresence {
  readonly id: string;
  stop(): Promise<void>;
}

export interface WorkersService {
  /** Records this process as a worker and keeps its heartbeat until `stop()`. */
  announce(): Promise<WorkerPresence>;
  /** A supervisor saw its worker `pid` on this host end unasked: records how. */
  recordUnaskedEnd(pid: number, how: string): Promise<void>;
  overview(now?: Date): Promise<WorkersOverviewDto>;
}

function conditionOf(record: WorkerRecord, now: number): WorkerCondition {
  if (record.endedAt) return record.endedUnasked ? 'ended-unasked' : 'stopped';
  return now - record.seenAt.getTime() > SILENT_AFTER_MS ? 'silent' : 'taking-jobs';
}

function toWorkerDto(record: WorkerRecord, now: number): WorkerDto {
  return {
    id: record.id,
    name: `${record.host}:${record.pid}`,
    startedAt: record.startedAt.toISOString(),
    seenAt: record.seenAt.toISOString(),
    endedAt: record.endedAt?.toISOString() ?? null,
    endedHow: record.endedHow,
    condition: conditionOf(record, now),
  };
}

/** The sentence for the admins, when the workers need them. */
function attentionOf(takingJobs: number, lostInLastHour: number, waitingRuns: number): string | null {
  if (lostInLastHour >= WORKER_DYING_ENDS_PER_HOUR) {
    return `Analysis workers ended unasked or went silent ${lostInLastHour} times in the last hour: one keeps dying. Read its output on its machine (npm start prints each end); runs wait meanwhile, nothing is lost.`;
  }
  if (takingJobs === 0 && waitingRuns > 0) {
    return `No analysis worker takes jobs, and ${waitingRuns} run${waitingRuns === 1 ? ' waits' : 's wait'}. npm start runs one; a machine of its own runs npm run worker.`;
  }
  return null;
}

/** The analysis workers' records: each worker announces itself and beats; admins read the overview. */
export function createWorkersService(models: Models): WorkersService {
  const { WorkerRecord: Workers, Run } = models;
  const host = os.hostname();

  return {
    async announce() {
      const id = crypto.randomUUID();
      await Workers.create({ id, host, pid: process.pid });
      const beat = setInterval(() => {
        // A missed beat (the database restarting) is only a later "silent"; the next one mends it.
        void Workers.update({ seenAt: new Date() }, { where: { id, endedAt: null } }).catch(() => undefined);
      }, WORKER_HEARTBEAT_SECONDS * 1000);
      beat.unref();
      return {
        id,
        async stop() {
          clearInterval(beat);
          await Workers.update({ endedAt: new Date(), endedHow: 'stopped when asked', seenAt: new Date() }, { where: { id, endedAt: null } });
        },
      };
    },

    async recordUnaskedEnd(pid, how) {
      await Workers.update({ endedAt: new Date(), endedHow: how, endedUnasked: true }, { where: { host, pid, endedAt: null } });
    },

    async overview(now = new Date()) {
      const time = now.getTime();
      const dayAgo = new Date(time - 24 * HOUR_MS);
      const records = await Workers.findAll({
        // Started within a day, or still not ended and heard from within a day.
        where: { [Op.or]: [{ startedAt: { [Op.gte]: dayAgo } }, { endedAt: null, seenAt: { [Op.gte]: dayAgo } }] },
        order: [['startedAt', 'DESC']],
        limit: SHOWN_WORKERS,
      });
      const workers = records.map((record) => toWorkerDto(record, time));
      const takingJobs = workers.filter((worker) => worker.condition === 'taking-jobs').length;
      const hourAgo = time - HOUR_MS;
      const lostInLastHour = records.filter((record) => {
        const condition = conditionOf(record, time);
        if (condition === 'ended-unasked') return record.endedAt!.getTime() >= hourAgo;
        return condition === 'silent' && record.seenAt.getTime() >= hourAgo;
      }).length;
      const silentSince = new Date(time - SILENT_AFTER_MS);
      const waitingRuns = await Run.count({
        where: { [Op.or]: [{ state: 'queued' }, { state: 'analysing', heartbeatAt: { [Op.lt]: silentSince } }] },
      });
      return { workers, takingJobs, lostInLastHour, waitingRuns, attention: attentionOf(takingJobs, lostInLastHour, waitingRuns) };
    },
  };
}
