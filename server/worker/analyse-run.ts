import os from 'node:os';
import type { Sequelize } from 'sequelize';
import { AnalysisCancelledError } from '@shared/analysis/node';
import type { AnalysisProgress } from '@shared/analysis/node';
import { FINISHED_STATES, WORKER_HEARTBEAT_SECONDS, STATE_OF_VERDICT } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { signStatement } from '../integrity/signed-statement';
import type { SigningKey } from '../integrity/signing-key';
import type { AnalysisQueue } from '../queue/analysis-queue';
import type { LogStore } from '../storage/log-store';
import { log } from '../system/log';
import { signedInputSha256 } from '../runs/station-pair-record';
import { analyseArchivedRun } from './analyse-archived-run';

/** Progress is written to the run when it has moved by this much (a fraction of the whole). */
const PROGRESS_STEP = 0.03;

export interface AnalyseRunDeps {
  sequelize: Sequelize;
  models: Models;
  logStore: LogStore;
  /** This worker's own folder for copies of the logs it analyses. */
  workFolder: string;
  queue: AnalysisQueue;
  audit: AuditTrail;
  signingKey: SigningKey;
}

/**
 * One analysis job: runs the engine on the archived file with the run's profile version, mapping
 * and seed, writing progress as it reads, then stores the result with its signature, the state and
 * the verdict-mail job in one transaction. Idempotent: a job delivered again for a run that has its result does
 * nothing more, so a retried job ends with exactly one stored result.
 */
export async function analyseRun(runId: number, deps: AnalyseRunDeps, signal: AbortSignal): Promise<void> {
  const { sequelize, models, logStore, workFolder, queue, audit, signingKey } = deps;
  const run = await models.Run.findByPk(runId);
  if (!run || FINISHED_STATES.includes(run.state)) return;

  const worker = `${os.hostname()}:${process.pid}`;
  const startedAt = new Date();
  await models.Run.update(
    { state: 'analysing', progress: 0, attempts: run.attempts + 1, analysedBy: worker, startedAt, heartbeatAt: startedAt, error: null },
    { where: { id: runId } },
  );
  await audit.record({ actorId: null, action: 'run.analysis-started', targetType: 'run', targetId: runId, details: { attempt: run.attempts + 1, worker } });

  let written = 0;
  let counted = false;
  let pendingWrite: Promise<unknown> = Promise.resolve();
  const onProgress = ({ phase, bytesRead, totalBytes }: AnalysisProgress) => {
    if (!totalBytes) return;
    // With a counting pass the count fills the first half of the bar and the analysis the second;
    // with the upload's census the analysis alone fills it.
    counted ||= phase === 'counting';
    const progress = counted ? Math.min(1, (phase === 'counting' ? 0 : 0.5) + (0.5 * bytesRead) / totalBytes) : Math.min(1, bytesRead / totalBytes);
    if (progress - written < PROGRESS_STEP) return;
    written = progress;
    // Progress is a courtesy: a write lost while the database restarts must not end the analysis.
    pendingWrite = pendingWrite.then(() => models.Run.update({ progress }, { where: { id: runId, state: 'analysing' } })).catch(() => undefined);
  };

  // Alive, however slowly the log comes (an S3 copy shows no progress): a silent run's worker is gone.
  const heartbeat = setInterval(() => {
    void models.Run.update({ heartbeatAt: new Date() }, { where: { id: runId, state: 'analysing', analysedBy: worker } }).catch(() => undefined);
  }, WORKER_HEARTBEAT_SECONDS * 1000);
  let result;
  try {
    result = await analyseArchivedRun(run, { models, logStore, workFolder }, { onProgress, signal }).finally(() => clearInterval(heartbeat));
  } catch (error) {
    await pendingWrite;
    // Cancelled (the worker is stopping): the job fails and the queue hands it out again.
    if (error instanceof AnalysisCancelledError) throw error;
    await finishAsFailed(runId, error, deps);
    return;
  }
  await pendingWrite;
  const input = signedInputSha256(run);
  if (result.input.sha256 !== input) {
    const what = run.stationBSha256 ? 'The archived station logs’ joint digest' : 'The archived file’s SHA-256';
    await finishAsFailed(runId, new Error(`${what} is ${result.input.sha256}, not the ${input} recorded at upload: the archive was changed.`), deps);
    return;
  }

  const state = STATE_OF_VERDICT[result.verdict];
  const signedAt = new Date();
  const { keyId, signature } = signStatement({ runId, fileSha256: input, fingerprint: result.fingerprint, signedAt: signedAt.toISOString() }, signingKey);
  await sequelize.transaction(async (transaction) => {
    const [stored] = await models.Run.update(
      { state, verdict: result.verdict, result, progress: 1, finishedAt: signedAt, signingKeyId: keyId, signedAt, signature },
      { where: { id: runId, state: 'analysing' }, transaction },
    );
    if (stored === 0) return;
    await audit.record(
      {
        actorId: null,
        action: 'run.finished',
        targetType: 'run',
        targetId: runId,
        details: { state, verdict: result.verdict, fingerprint: result.fingerprint, reasons: result.reasons },
      },
      transaction,
    );
    await queue.enqueueVerdictMail(runId, transaction);
  });
  const seconds = (signedAt.getTime() - startedAt.getTime()) / 1000;
  log.info({ runId, verdict: result.verdict, bytes: result.input.bytes, seconds, bytesPerSecond: Math.round(result.input.bytes / seconds) }, 'analysis finished');
}

async function finishAsFailed(runId: number, error: unknown, { models, audit, sequelize }: AnalyseRunDeps): Promise<void> {
  const message = error instanceof Error ? error.message : String(error);
  await sequelize.transaction(async (transaction) => {
    await models.Run.update({ state: 'failed', error: message, finishedAt: new Date() }, { where: { id: runId }, transaction });
    await audit.record({ actorId: null, action: 'run.failed', targetType: 'run', targetId: runId, details: { error: message } }, transaction);
  });
}
