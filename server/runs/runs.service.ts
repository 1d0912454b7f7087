import crypto from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { FINISHED_STATES, VERDICT_STATES, type RunDto, type RunPageDto, type RunSortKey, type RunState, type SignOffDto, type Verdict } from '../../shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { AnalysisQueue } from '../queue/analysis-queue';
import type { ProfileVersionRecord } from '../profiles/profile.model';
import type { ProfilesService } from '../profiles/profiles.service';
import type { SetupsService } from '../setups/setups.service';
import type { LogStore, ReceivedLog } from '../storage/log-store';
import { storedSignature } from '../integrity/stored-signature';
import { toRunDto, toRunSummary, type RunRow } from './run-dto';

export interface NewRun {
  setupId: number;
  profileId?: number;
  profileVersionId?: number;
  mapping?: Record<string, unknown>;
  acquiredOn?: string;
  notes?: string;
  originalName: string;
  /** The uploaded bytes, received and hashed; kept under their SHA-256 here once the run is valid. */
  log: ReceivedLog;
}

export interface RunFilter {
  setupId?: number;
  state?: RunState;
  verdict?: Verdict;
  /** Inclusive bounds on the acquisition date (or the upload date when none was given), YYYY-MM-DD. */
  from?: string;
  to?: string;
  uploadedBy?: number;
  profileVersionId?: number;
  /** Hex prefixes of the file's SHA-256 and of the result's fingerprint. */
  sha256?: string;
  fingerprint?: string;
  /** Only runs whose analysis has ended. */
  finished?: boolean;
  sort: RunSortKey;
  direction: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export interface RunsService {
  create(run: NewRun, actorId: number): Promise<RunDto>;
  list(filter: RunFilter): Promise<RunPageDto>;
  get(id: number, transaction?: Transaction): Promise<RunDto>;
  signOff(id: number, comment: string, actor: { id: number; name: string }): Promise<SignOffDto>;
}

const SORT_COLUMNS: Record<RunSortKey, string> = {
  createdAt: 'r.created_at',
  acquiredOn: 'r.acquired_on',
  setup: 'lower(s.name)',
  state: 'r.state',
  verdict: 'r.verdict',
  winFraction: "(r.result #>> '{chsh,winFraction}')::float8",
};

const RUN_SELECT = `
  SELECT r.id, r.setup_id, s.name AS setup_name, r.profile_version_id, p.name AS profile_name,
         v.version AS profile_version, (v.parameters ->> 'chshTolerance')::float8 AS chsh_tolerance,
         CASE WHEN v.parameters ->> 'securityModel' = 'general' THEN (r.result #>> '{key,generalAttack,omegaThreshold}')::float8 END AS general_threshold,
         r.state, r.progress, r.verdict,
         (r.result #>> '{chsh,winFraction}')::float8 AS win_fraction,
         (r.result #>> '{qber,rate}')::float8 AS qber,
         (r.result #>> '{chsh,S}')::float8 AS chsh_value,
         (r.result #>> '{key,finiteKeyBits}')::float8 AS finite_key_bits,
         u.name AS uploaded_by_name, to_char(r.acquired_on, 'YYYY-MM-DD') AS acquired_on,
         r.created_at, r.finished_at, r.duplicate_of, r.file_sha256, r.result ->> 'fingerprint' AS fingerprint,
         EXISTS (SELECT 1 FROM run_sign_offs o WHERE o.run_id = r.id) AS signed_off
    FROM runs r
    JOIN setups s ON s.id = r.setup_id
    JOIN profile_versions v ON v.id = r.profile_version_id
    JOIN profiles p ON p.id = v.profile_id
    JOIN users u ON u.id = r.uploaded_by`;

/** Runs: created from an archived upload, read with paging and filters, signed off by shift leads. */
export function createRunsService(deps: {
  sequelize: Sequelize;
  models: Models;
  logStore: LogStore;
  queue: AnalysisQueue;
  profiles: ProfilesService;
  setups: SetupsService;
  audit: AuditTrail;
}): RunsService {
  const { sequelize, models, logStore, queue, profiles, setups, audit } = deps;

  async function get(id: number, transaction?: Transaction): Promise<RunDto> {
    const [row] = await sequelize.query<RunRow>(`${RUN_SELECT} WHERE r.id = :id`, { type: QueryTypes.SELECT, replacements: { id }, transaction });
    if (!row) throw HttpError.notFound(`There is no run with id ${id}.`);
    const run = (await models.Run.findByPk(id, { transaction }))!;
    const file = (await models.ArchiveFile.findByPk(run.fileSha256, { transaction }))!;
    const signOff = await models.SignOff.findByPk(id, { transaction });
    const signer = signOff ? await models.User.findByPk(signOff.userId, { transaction }) : null;
    const deliveries = await models.MailDelivery.findAll({ where: { runId: id }, order: [['attemptedAt', 'ASC']], transaction });
    return toRunDto(row, {
      file: { sha256: file.sha256, bytes: file.bytes, originalName: run.originalName },
      seed: run.seed,
      mapping: run.mapping,
      notes: run.notes,
      error: run.error ?? null,
      attempts: run.attempts,
      analysedBy: run.analysedBy ?? null,
      startedAt: run.startedAt ?? null,
      result: run.result ?? null,
      signature: storedSignature(run),
      signOff: signOff && signer ? { userId: signer.id, userName: signer.name, comment: signOff.comment, createdAt: signOff.createdAt.toISOString() } : null,
      deliveries: deliveries.map((delivery) => ({
        recipients: [...delivery.recipients],
        status: delivery.status,
        messageId: delivery.messageId,
        error: delivery.error,
        attemptedAt: delivery.attemptedAt.toISOString(),
      })),
    });
  }

  return {
    get,

    async create(newRun, actorId) {
      const asBadField = (field: string) => (error: unknown) => {
        throw error instanceof HttpError && error.status === 404 ? HttpError.badRequest(error.message, field) : error;
      };
      const setup = await setups.get(newRun.setupId).catch(asBadField('setupId'));
      const profileVersion = await profiles.latestVersionOf(setup.defaultProfileId);
      refuseChosenProfile(newRun, setup.name, profileVersion);
      const { sha256, bytes } = newRun.log;
      const { isNew: fileWasNew } = await newRun.log.keep();
      try {
        const id = await sequelize.transaction(async (transaction) => {
          await models.ArchiveFile.findOrCreate({ where: { sha256 }, defaults: { sha256, bytes }, transaction });
          const earlier = await models.Run.findOne({ where: { fileSha256: sha256 }, order: [['id', 'ASC']], transaction });
          const run = await models.Run.create(
            {
              setupId: setup.id,
              profileVersionId: profileVersion.id,
              fileSha256: sha256,
              originalName: newRun.originalName.slice(0, 255),
              duplicateOf: earlier?.id ?? null,
              uploadedBy: actorId,
              acquiredOn: newRun.acquiredOn ?? null,
              notes: newRun.notes ?? '',
              mapping: newRun.mapping ?? null,
              // Drawn now, not by the worker, so every retry of the analysis uses the same seed; the
              // same bytes uploaded again keep the first run's seed, so re-uploading draws nothing new.
              seed: earlier?.seed ?? crypto.randomBytes(32).toString('hex'),
            },
            { transaction },
          );
          await audit.record(
            { actorId, action: 'run.uploaded', targetType: 'run', targetId: run.id, details: { sha256, bytes, duplicateOf: run.duplicateOf } },
            transaction,
          );
          await queue.enqueueAnalysis(run.id, transaction);
          return run.id;
        });
        return get(id);
      } catch (error) {
        // Nothing may point at bytes archived for a run that was never made.
        if (fileWasNew && !(await models.ArchiveFile.findByPk(sha256))) await logStore.discard(sha256);
        throw error;
      }
    },

    async list(filter) {
      const conditions: string[] = [];
      const replacements: Record<string, unknown> = {};
      const add = (condition: string, name: string, value: unknown) => {
        if (value === undefined) return;
        conditions.push(condition);
        replacements[name] = value;
      };
      add('r.setup_id = :setupId', 'setupId', filter.setupId);
      add('r.state = :state', 'state', filter.state);
      add('r.verdict = :verdict', 'verdict', filter.verdict);
      add('r.uploaded_by = :uploadedBy', 'uploadedBy', filter.uploadedBy);
      add('coalesce(r.acquired_on, r.created_at::date) >= :from', 'from', filter.from);
      add('coalesce(r.acquired_on, r.created_at::date) <= :to', 'to', filter.to);
      add('r.profile_version_id = :profileVersionId', 'profileVersionId', filter.profileVersionId);
      add("r.file_sha256 LIKE :sha256 || '%'", 'sha256', filter.sha256);
      add("r.result ->> 'fingerprint' LIKE :fingerprint || '%'", 'fingerprint', filter.fingerprint);
      add('r.state IN (:finishedStates)', 'finishedStates', filter.finished ? FINISHED_STATES : undefined);
      const where = conditions.length > 0 ? `WHERE ${conditions.join(' AND ')}` : '';
      const order = `${SORT_COLUMNS[filter.sort]} ${filter.direction === 'asc' ? 'ASC' : 'DESC'} NULLS LAST, r.id DESC`;
      const rows = await sequelize.query<RunRow>(`${RUN_SELECT} ${where} ORDER BY ${order} LIMIT :limit OFFSET :offset`, {
        type: QueryTypes.SELECT,
        replacements: { ...replacements, limit: filter.pageSize, offset: filter.page * filter.pageSize },
      });
      const [{ total }] = await sequelize.query<{ total: string }>(
        `SELECT count(*) AS total FROM runs r ${where}`,
        { type: QueryTypes.SELECT, replacements },
      );
      return { items: rows.map(toRunSummary), total: Number(total), page: filter.page, pageSize: filter.pageSize };
    },

    async signOff(id, comment, actor) {
      return sequelize.transaction(async (transaction) => {
        const run = await models.Run.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
        if (!run) throw HttpError.notFound(`There is no run with id ${id}.`);
        if (!(await setups.isShiftLeadOf(run.setupId, actor.id))) {
          throw HttpError.forbidden('Only a shift lead assigned to this run’s setup can sign it off.');
        }
        if (!VERDICT_STATES.includes(run.state)) {
          throw HttpError.conflict(`Run ${id} is ${run.state}; a run is signed off once its verdict is in.`);
        }
        if (await models.SignOff.findByPk(id, { transaction })) throw HttpError.conflict(`Run ${id} is already signed off.`);
        const signOff = await models.SignOff.create({ runId: id, userId: actor.id, comment: comment.trim() }, { transaction });
        await audit.record({ actorId: actor.id, action: 'run.signed-off', targetType: 'run', targetId: id, details: { comment: signOff.comment, verdict: run.verdict } }, transaction);
        return { userId: actor.id, userName: actor.name, comment: signOff.comment, createdAt: signOff.createdAt.toISOString() };
      });
    },
  };
}

/**
 * An upload is judged under its setup's profile, latest version, and nothing else: the uploader
 * who could pick a looser profile could pick the verdict. Naming that same profile or version is
 * harmless; naming another is refused with why.
 */
function refuseChosenProfile(newRun: NewRun, setupName: string, setupVersion: ProfileVersionRecord): void {
  const chosenOther =
    (newRun.profileId !== undefined && newRun.profileId !== setupVersion.profileId) ||
    (newRun.profileVersionId !== undefined && newRun.profileVersionId !== setupVersion.id);
  if (!chosenOther) return;
  throw HttpError.forbidden(
    `Runs on ${setupName} are judged under the setup’s own acceptance profile (version ${setupVersion.version}); an upload cannot choose another. An admin may change the setup’s profile before the night.`,
  );
}
