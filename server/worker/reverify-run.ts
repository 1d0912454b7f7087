import os from 'node:os';
import type { Sequelize } from 'sequelize';
import { AnalysisCancelledError } from '@shared/analysis/node';
import type { ReverificationState } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { resultDifferences } from '../integrity/result-differences';
import type { LogStore } from '../storage/log-store';
import { analyseArchivedRun } from './analyse-archived-run';

/** Differences kept on the record; the count says how many there were in all. */
const KEPT_DIFFERENCES = 50;

export interface ReverifyRunDeps {
  sequelize: Sequelize;
  models: Models;
  logStore: LogStore;
  workFolder: string;
  audit: AuditTrail;
}

/**
 * One re-verification job: analyses the run's archived file again as recorded and compares the
 * new result with the stored one, field by field. The outcome is written to the re-verification's
 * own record; the run and its signed result stay as they are. Idempotent like `analyseRun`.
 */
export async function reverifyRun(reverificationId: number, deps: ReverifyRunDeps, signal: AbortSignal): Promise<void> {
  const { sequelize, models, logStore, workFolder, audit } = deps;
  const record = await models.Reverification.findByPk(reverificationId);
  if (!record || !['queued', 'analysing'].includes(record.state)) return;
  const run = (await models.Run.findByPk(record.runId))!;
  await record.update({ state: 'analysing', attempts: record.attempts + 1, startedAt: new Date(), error: null });

  let outcome: Partial<typeof record.dataValues> & { state: ReverificationState };
  try {
    // With another seed (an admin's), the same log and profile under a fresh draw of test rounds.
    const result = await analyseArchivedRun(record.seed ? { ...run.get(), seed: record.seed } : run, { models, logStore, workFolder }, { signal });
    const differences = resultDifferences(run.result, result);
    outcome = {
      state: result.fingerprint === record.storedFingerprint ? 'reproduced' : 'differs',
      newFingerprint: result.fingerprint,
      newEngineVersion: result.engineVersion,
      result,
      differences: differences.slice(0, KEPT_DIFFERENCES),
      differenceCount: differences.length,
    };
  } catch (error) {
    if (error instanceof AnalysisCancelledError) throw error;
    outcome = { state: 'failed', error: error instanceof Error ? error.message : String(error) };
  }

  await sequelize.transaction(async (transaction) => {
    await record.update({ ...outcome, finishedAt: new Date() }, { transaction });
    await audit.record(
      {
        actorId: null,
        action: 'run.reverification-finished',
        targetType: 'run',
        targetId: run.id,
        details: {
          reverificationId,
          state: outcome.state,
          newFingerprint: outcome.newFingerprint ?? null,
          differenceCount: outcome.differenceCount ?? 0,
          worker: `${os.hostname()}:${process.pid}`,
        },
      },
      transaction,
    );
  });
}
