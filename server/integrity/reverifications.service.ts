import type { Sequelize } from 'sequelize';
import { VERDICT_STATES, type ReverificationDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { AnalysisQueue } from '../queue/analysis-queue';
import type { ReverificationRecord } from './integrity.model';

export interface ReverificationsService {
  /**
   * Queues a re-analysis of a run's archived file, as recorded or (an admin's) with another seed;
   * the original result and verdict are never touched.
   */
  request(runId: number, actorId: number, seed?: string): Promise<ReverificationDto>;
  /** A run's re-verifications, newest first. */
  list(runId: number): Promise<ReverificationDto[]>;
}

export function createReverificationsService(deps: { sequelize: Sequelize; models: Models; queue: AnalysisQueue; audit: AuditTrail }): ReverificationsService {
  const { sequelize, models, queue, audit } = deps;

  async function toDtos(records: ReverificationRecord[]): Promise<ReverificationDto[]> {
    const people = await models.User.findAll({ where: { id: [...new Set(records.map((record) => record.requestedBy))] } });
    return records.map((record) => ({
      id: record.id,
      runId: record.runId,
      requestedBy: people.find((person) => person.id === record.requestedBy)?.name ?? '',
      seed: record.seed ?? null,
      state: record.state,
      storedFingerprint: record.storedFingerprint,
      storedEngineVersion: record.storedEngineVersion,
      newFingerprint: record.newFingerprint ?? null,
      newEngineVersion: record.newEngineVersion ?? null,
      differences: record.differences,
      differenceCount: record.differenceCount,
      error: record.error ?? null,
      createdAt: record.createdAt.toISOString(),
      finishedAt: record.finishedAt?.toISOString() ?? null,
    }));
  }

  return {
    async request(runId, actorId, seed) {
      const id = await sequelize.transaction(async (transaction) => {
        const run = await models.Run.findByPk(runId, { transaction });
        if (!run) throw HttpError.notFound(`There is no run with id ${runId}.`);
        if (!VERDICT_STATES.includes(run.state) || !run.result) {
          throw HttpError.conflict(`Run ${runId} is ${run.state}: only a run with a stored result can be re-verified.`);
        }
        const record = await models.Reverification.create(
          { runId, requestedBy: actorId, seed: seed ?? null, storedFingerprint: run.result.fingerprint, storedEngineVersion: run.result.engineVersion },
          { transaction },
        );
        await audit.record(
          { actorId, action: 'run.reverification-requested', targetType: 'run', targetId: runId, details: { reverificationId: record.id, ...(seed ? { seed } : {}) } },
          transaction,
        );
        await queue.enqueueReverification(record.id, transaction);
        return record.id;
      });
      return (await toDtos([(await models.Reverification.findByPk(id))!]))[0];
    },

    async list(runId) {
      if (!(await models.Run.findByPk(runId))) throw HttpError.notFound(`There is no run with id ${runId}.`);
      return toDtos(await models.Reverification.findAll({ where: { runId }, order: [['id', 'DESC']] }));
    },
  };
}
