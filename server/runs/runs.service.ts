import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import {
  FINISHED_STATES,
  VERDICT_STATES,
  type RunDto,
  type RunListQuery,
  type RunPageDto,
  type RunSortKey,
  type SetupDto,
  type RealignRequest,
  type RunStationsDto,
  type SignOffDto,
  type SignOffRequest,
  type StationLogDto,
  type StationLogQuery,
  type StationName,
  type WithdrawalDto,
  type WithdrawRequest,
} from '@shared/api';
import type { ColumnMapping } from '@shared/analysis';
import type { AuditTrail } from '../audit/audit-trail';
import type { BookingRecord } from '../bookings/booking.model';
import type { BookingsService } from '../bookings/bookings.service';
import { drawSeed } from '../bookings/seed-commitment';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { AnalysisQueue } from '../queue/analysis-queue';
import type { ProfileVersionRecord } from '../profiles/profile.model';
import type { ProfilesService } from '../profiles/profiles.service';
import type { SetupsService } from '../setups/setups.service';
import type { LogStore } from '../storage/log-store';
import type { ReceivedRunLog } from './log-storage-engine';
import { storedSignature } from '../integrity/stored-signature';
import { uploaderInTrail, type Uploader } from '../upload-tokens/uploader';
import type { RunRecord } from './run.model';
import { toRunDto, toRunSummary, type RunRow } from './run-dto';
import { AWAITING_SIGN_OFF } from './awaiting-sign-off';
import { withdrawalOf, withdrawRun, type Withdrawer } from './run-withdrawals';
import { createStationLogs, pairMapping, setupGeometry, stationMapping, stationOfUpload } from './station-logs';

export interface NewRun {
  setupId: number;
  profileId?: number;
  profileVersionId?: number;
  mapping?: Record<string, unknown>;
  /** The booking the log is for; when absent, the setup's booking of the night, if any (see BookingsService). */
  bookingId?: number;
  acquiredOn?: string;
  notes?: string;
  /** Required when the booking has a log already: why this one replaces it. */
  replacementReason?: string;
  originalName: string;
  /** The uploaded bytes, received and hashed, with their census; kept under their SHA-256 here once the run is valid. */
  log: ReceivedRunLog;
}

/** What became of a station's log: the run of the night's pair, or the log waiting for the other station's. */
export type StationArrival = { run: RunDto; stationLog: StationLogDto } | { run: null; stationLog: StationLogDto };

/** The files a run reads: one joined log, or station A's (`fileSha256`) and station B's with the setup's geometry. */
type RunFiles = Pick<RunRecord, 'setupId' | 'fileSha256' | 'originalName' | 'mapping'> & Partial<Pick<RunRecord, 'stationBSha256' | 'stationBName' | 'stationGeometry'>>;

/** At most `limit` characters as PostgreSQL counts them, code points: a cut between UTF-16 units could split a pair. */
function codePoints(text: string, limit: number): string {
  return [...text].slice(0, limit).join('');
}

export interface RunsService {
  create(run: NewRun, uploader: Uploader): Promise<RunDto>;
  /**
   * One station's own log of a night: kept until the other station's log of the same night (its
   * booking, or unbooked its setup and date) is in, and then joined with it into one run.
   */
  receiveStationLog(run: NewRun & { station: StationName }, uploader: Uploader): Promise<StationArrival>;
  /** Station logs, newest first: all, or those still waiting for the other station's. */
  stationLogs(filter: StationLogQuery): Promise<StationLogDto[]>;
  /** One station's log, waiting or joined into a run. */
  stationLog(id: number): Promise<StationLogDto>;
  /** Re-runs a pair's two logs at a stated offset, on a shift lead's word and reason: a new attempt of the night. */
  realign(id: number, request: RealignRequest, actor: { id: number; name: string }): Promise<RunDto>;
  /**
   * Refuses, before any byte is sent, what `create` would refuse for these fields whatever the
   * bytes: another setup's token, a chosen profile, a booking's window not yet open, a replacement
   * without a reason. A resumable upload asks this when it is created.
   */
  refuseEarly(run: Omit<NewRun, 'log' | 'originalName'> & { station?: StationName }, uploader: Uploader): Promise<void>;
  list(filter: RunListQuery): Promise<RunPageDto>;
  get(id: number, transaction?: Transaction): Promise<RunDto>;
  /**
   * A shift lead of the run's setup signs off its verdict with a decision and a comment; under the
   * setup's four-eyes rule not the person who uploaded it, and a key is kept only from an ACCEPT
   * that has one.
   */
  signOff(id: number, request: SignOffRequest, actor: { id: number; name: string }): Promise<SignOffDto>;
  /** Its uploader or an admin withdraws a mistaken upload before its sign-off (see run-withdrawals.ts). */
  withdraw(id: number, request: WithdrawRequest, actor: Withdrawer): Promise<WithdrawalDto>;
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
         coalesce(u.name, 'upload token “' || t.name || '”') AS uploaded_by_name, r.booking_id, r.attempt, r.replay_of, to_char(r.acquired_on, 'YYYY-MM-DD') AS acquired_on,
         r.created_at, r.finished_at, r.duplicate_of, r.file_sha256, r.result ->> 'fingerprint' AS fingerprint,
         EXISTS (SELECT 1 FROM run_sign_offs o WHERE o.run_id = r.id) AS signed_off, r.station_b_sha256 IS NOT NULL AS station_pair,
         EXISTS (SELECT 1 FROM run_withdrawals w WHERE w.run_id = r.id) AS withdrawn
    FROM runs r
    JOIN setups s ON s.id = r.setup_id
    JOIN profile_versions v ON v.id = r.profile_version_id
    JOIN profiles p ON p.id = v.profile_id
    LEFT JOIN users u ON u.id = r.uploaded_by
    LEFT JOIN upload_tokens t ON t.id = r.upload_token_id`;

/** Runs: created from an archived upload, read with paging and filters, signed off by shift leads. */
export function createRunsService(deps: {
  sequelize: Sequelize;
  models: Models;
  logStore: LogStore;
  queue: AnalysisQueue;
  profiles: ProfilesService;
  setups: SetupsService;
  bookings: BookingsService;
  audit: AuditTrail;
}): RunsService {
  const { sequelize, models, logStore, queue, profiles, setups, bookings, audit } = deps;
  const stationLogs = createStationLogs(models, audit);

  /** The setup an upload is for, which an upload token must be of. */
  async function uploadSetup(newRun: Pick<NewRun, 'setupId'>, uploader: Uploader): Promise<SetupDto> {
    if (uploader.kind === 'token' && uploader.token.setupId !== newRun.setupId) {
      throw HttpError.forbidden(`Upload token “${uploader.token.name}” uploads to its own setup only (setup ${uploader.token.setupId}).`);
    }
    return setups.get(newRun.setupId).catch((error: unknown) => {
      throw error instanceof HttpError && error.status === 404 ? HttpError.badRequest(error.message, 'setupId') : error;
    });
  }

  /** The upload's booking, if any, and the profile version it is judged under, refusing a chosen other one. */
  async function bookingAndProfile(newRun: Omit<NewRun, 'log' | 'originalName'>, setup: SetupDto, transaction: Transaction) {
    const booking = await bookings.bookingForUpload(setup.id, newRun, transaction);
    // Every query in the transaction: one beside it needs a second pooled connection while this one
    // is held, and as many uploads at once as the pool has connections then wait on each other.
    const profileVersion = booking
      ? (await models.ProfileVersion.findByPk(booking.profileVersionId, { transaction }))!
      : await profiles.latestVersionOf(setup.defaultProfileId, transaction);
    refuseChosenProfile(newRun, booking ? `booking ${booking.id}` : `${setup.name}, unbooked,`, profileVersion);
    return { booking, profileVersion };
  }

  /**
   * Where a booked upload stands: attempt k of its booking, under the booking's seed. The bytes of
   * an earlier run are refused (a replay: the same data judged twice), and a second log of the
   * night needs a reason.
   */
  async function bookedPlace(booking: BookingRecord, newRun: Omit<NewRun, 'log' | 'originalName'>, earlier: RunRecord | null, transaction: Transaction) {
    if (earlier) {
      throw HttpError.conflict(
        `These bytes are already run ${earlier.id}${earlier.bookingId === booking.id ? ` (attempt ${earlier.attempt} of this booking)` : ''}: a log is judged once, under one seed. Upload the night’s own log.`,
      );
    }
    refuseOutsideBooking(booking, newRun);
    const previous = await models.Run.findAll({ where: { bookingId: booking.id }, order: [['attempt', 'ASC']], transaction });
    const reason = newRun.replacementReason?.trim() ?? '';
    if (previous.length > 0 && reason === '') {
      const last = previous[previous.length - 1];
      throw HttpError.badRequest(
        `replacementReason: the night of ${booking.night} already has run ${last.id} (attempt ${last.attempt}); a replacement needs a reason, and keeps the earlier runs`,
        'replacementReason',
      );
    }
    return {
      bookingId: booking.id,
      attempt: previous.length + 1,
      replacementReason: previous.length > 0 ? reason : null,
      acquiredOn: booking.night,
      seed: booking.seed,
      replayOf: null,
    };
  }

  /**
   * An unbooked upload: its seed drawn now, after the data existed, unless the same bytes came
   * before (they keep that run's seed, so uploading again draws nothing new). Bytes seen before
   * under a booking or another night are a replay, flagged.
   */
  function unbookedPlace(newRun: Pick<NewRun, 'acquiredOn'>, earlier: RunRecord | null) {
    const acquiredOn = newRun.acquiredOn ?? null;
    const replay = earlier !== null && (earlier.bookingId !== null || earlier.acquiredOn !== acquiredOn);
    return { bookingId: null, attempt: null, replacementReason: null, acquiredOn, seed: earlier?.seed ?? drawSeed(), replayOf: replay ? earlier.id : null };
  }

  /**
   * Keeps the uploaded logs in the archive and runs `work` in one transaction; when it fails, the
   * bytes it archived for nothing are thrown away again (nothing may point at bytes of a run that
   * was never made), and the error goes on.
   */
  async function keepingUpload<T>(logs: ReceivedRunLog[], work: (transaction: Transaction) => Promise<T>): Promise<T> {
    const kept = await Promise.all(logs.map((log) => log.keep()));
    try {
      return await sequelize.transaction(work);
    } catch (error) {
      for (const [index, { isNew }] of kept.entries()) {
        const { sha256 } = logs[index];
        if (isNew && !(await models.ArchiveFile.findByPk(sha256))) await logStore.discard(sha256);
      }
      throw error;
    }
  }

  /** The archive's row of a kept log, with the census taken at upload. */
  async function archiveFile({ sha256, bytes, census }: ReceivedRunLog, transaction: Transaction): Promise<void> {
    const [file] = await models.ArchiveFile.findOrCreate({ where: { sha256 }, defaults: { sha256, bytes, census }, transaction });
    if (file.census === null && census !== null) await file.update({ census }, { transaction });
  }

  /** The earliest run that read any of these files, as a joined log or a station's. */
  function earlierRunOf(sha256s: string[], transaction: Transaction): Promise<RunRecord | null> {
    return models.Run.findOne({ where: { [Op.or]: [{ fileSha256: sha256s }, { stationBSha256: sha256s }] }, order: [['id', 'ASC']], transaction });
  }

  /** A new run of an upload (a joined log, or a night's two station logs): its place in its booking or night, its trail line, its analysis job. */
  async function insertRun(
    upload: { newRun: Omit<NewRun, 'log' | 'originalName'>; uploader: Uploader; booking: BookingRecord | null; profileVersion: ProfileVersionRecord },
    files: RunFiles,
    transaction: Transaction,
  ): Promise<number> {
    const { newRun, uploader, booking, profileVersion } = upload;
    const sha256s = files.stationBSha256 ? [files.fileSha256, files.stationBSha256] : [files.fileSha256];
    const earlier = await earlierRunOf(sha256s, transaction);
    const place = booking ? await bookedPlace(booking, newRun, earlier, transaction) : unbookedPlace(newRun, earlier);
    const trail = uploaderInTrail(uploader);
    const run = await models.Run.create(
      {
        ...files,
        profileVersionId: profileVersion.id,
        originalName: codePoints(files.originalName, 255),
        stationBName: files.stationBSha256 ? codePoints(files.stationBName ?? '', 255) : null,
        duplicateOf: earlier?.id ?? null,
        uploadedBy: uploader.kind === 'person' ? uploader.user.id : null,
        uploadTokenId: uploader.kind === 'token' ? uploader.token.id : null,
        notes: newRun.notes ?? '',
        ...place,
      },
      { transaction },
    );
    await audit.record(
      {
        actorId: trail.actorId,
        action: 'run.uploaded',
        targetType: 'run',
        targetId: run.id,
        details: {
          ...trail.details,
          sha256: files.fileSha256,
          ...(files.stationBSha256 ? { stationBSha256: files.stationBSha256 } : {}),
          duplicateOf: run.duplicateOf,
          bookingId: run.bookingId,
          attempt: run.attempt,
          replacementReason: run.replacementReason,
          replayOf: run.replayOf,
        },
      },
      transaction,
    );
    await queue.enqueueAnalysis(run.id, transaction);
    return run.id;
  }

  /** A pair's station B file, stated offset and geometry. */
  async function runStations(run: RunRecord, transaction?: Transaction): Promise<RunStationsDto> {
    const fileB = (await models.ArchiveFile.findByPk(run.stationBSha256!, { transaction }))!;
    return {
      stationB: { sha256: fileB.sha256, bytes: fileB.bytes, originalName: run.stationBName ?? '' },
      offset: run.stationOffset ?? null,
      offsetReason: run.offsetReason ?? null,
      realignedFrom: run.realignedFrom ?? null,
      geometry: run.stationGeometry ?? null,
    };
  }

  async function get(id: number, transaction?: Transaction): Promise<RunDto> {
    const [row] = await sequelize.query<RunRow>(`${RUN_SELECT} WHERE r.id = :id`, { type: QueryTypes.SELECT, replacements: { id }, transaction });
    if (!row) throw HttpError.notFound(`There is no run with id ${id}.`);
    const run = (await models.Run.findByPk(id, { transaction }))!;
    const file = (await models.ArchiveFile.findByPk(run.fileSha256, { transaction }))!;
    const signOff = await models.SignOff.findByPk(id, { transaction });
    const signer = signOff ? await models.User.findByPk(signOff.userId, { transaction }) : null;
    const setup = (await models.Setup.findByPk(run.setupId, { transaction }))!;
    const deliveries = await models.MailDelivery.findAll({ where: { runId: id }, order: [['attemptedAt', 'ASC']], transaction });
    const booking = run.bookingId === null ? null : await bookings.get(run.bookingId, transaction);
    return toRunDto(row, {
      file: { sha256: file.sha256, bytes: file.bytes, originalName: run.originalName },
      seed: run.seed,
      mapping: run.mapping,
      notes: run.notes,
      error: run.error ?? null,
      attempts: run.attempts,
      analysedBy: run.analysedBy ?? null,
      startedAt: run.startedAt ?? null,
      heartbeatAt: run.heartbeatAt ?? null,
      result: run.result ?? null,
      signature: storedSignature(run),
      signOff:
        signOff && signer ? { userId: signer.id, userName: signer.name, decision: signOff.decision, comment: signOff.comment, createdAt: signOff.createdAt.toISOString() } : null,
      withdrawal: await withdrawalOf(models, id, transaction),
      uploadedById: run.uploadedBy,
      fourEyes: setup.fourEyes,
      stations: run.stationBSha256 ? await runStations(run, transaction) : null,
      booking: booking && {
        bookingId: booking.id,
        night: booking.night,
        seedCommitment: booking.seedCommitment,
        attempt: run.attempt!,
        replacementReason: run.replacementReason ?? '',
        attempts: booking.attempts,
      },
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
    withdraw: withdrawRun({ sequelize, models, audit }),
    stationLogs: (filter) => stationLogs.list(filter),
    stationLog: (id) => stationLogs.get(id),

    async refuseEarly(newRun, uploader) {
      const setup = await uploadSetup(newRun, uploader);
      if (newRun.station === undefined) refuseJoinedFromStationToken(uploader);
      else {
        stationOfUpload(newRun.station, uploader);
        stationMapping(newRun.mapping as ColumnMapping | undefined);
      }
      await sequelize.transaction(async (transaction) => {
        const { booking } = await bookingAndProfile(newRun, setup, transaction);
        if (newRun.station === undefined) {
          if (booking) await bookedPlace(booking, newRun, null, transaction);
        } else if (booking) refuseOutsideBooking(booking, newRun);
        else unbookedNight(newRun);
      });
    },

    async create(newRun, uploader) {
      const setup = await uploadSetup(newRun, uploader);
      refuseJoinedFromStationToken(uploader);
      const id = await keepingUpload([newRun.log], async (transaction) => {
        const { booking, profileVersion } = await bookingAndProfile(newRun, setup, transaction);
        await archiveFile(newRun.log, transaction);
        return insertRun(
          { newRun, uploader, booking, profileVersion },
          // An upload naming no mapping is read with its setup's saved one; the run keeps the one it used.
          { setupId: setup.id, fileSha256: newRun.log.sha256, originalName: newRun.originalName, mapping: newRun.mapping ?? setup.columnMapping ?? null },
          transaction,
        );
      });
      return get(id);
    },

    async receiveStationLog(newRun, uploader) {
      const setup = await uploadSetup(newRun, uploader);
      const station = stationOfUpload(newRun.station, uploader);
      const mapping = stationMapping(newRun.mapping as ColumnMapping | undefined);
      const outcome = await keepingUpload([newRun.log], async (transaction) => {
        const { booking, profileVersion } = await bookingAndProfile(newRun, setup, transaction);
        if (booking) refuseOutsideBooking(booking, newRun);
        // Two uploads of one night pair one at a time: the booking's row is locked, else the setup's.
        else await models.Setup.findByPk(setup.id, { transaction, lock: transaction.LOCK.UPDATE });
        await archiveFile(newRun.log, transaction);
        const night = { setupId: setup.id, bookingId: booking?.id ?? null, acquiredOn: booking ? null : unbookedNight(newRun) };
        const arrived = await stationLogs.arrive({ ...night, station, newRun, mapping, uploader }, transaction);
        const partner = await stationLogs.waitingPartner(arrived, transaction);
        if (!partner) return { runId: null, stationLogId: arrived.id };
        const [a, b] = station === 'A' ? [arrived, partner] : [partner, arrived];
        if (a.fileSha256 === b.fileSha256) {
          throw HttpError.badRequest(
            `station: this file is already station ${partner.station}'s log of the night (log ${partner.id}); each station uploads its own record`,
            'station',
          );
        }
        const runId = await insertRun(
          { newRun, uploader, booking, profileVersion },
          {
            setupId: setup.id,
            fileSha256: a.fileSha256,
            originalName: a.originalName,
            mapping: pairMapping(a, b),
            stationBSha256: b.fileSha256,
            stationBName: b.originalName,
            stationGeometry: setupGeometry(setup),
          },
          transaction,
        );
        await models.StationLog.update({ runId }, { where: { id: [a.id, b.id] }, transaction });
        return { runId, stationLogId: arrived.id };
      });
      const stationLog = await stationLogs.get(outcome.stationLogId);
      return outcome.runId === null ? { run: null, stationLog } : { run: await get(outcome.runId), stationLog };
    },

    async realign(id, { offset, reason }, actor) {
      const runId = await sequelize.transaction(async (transaction) => {
        const run = await models.Run.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
        if (!run) throw HttpError.notFound(`There is no run with id ${id}.`);
        if (!(await setups.isShiftLeadOf(run.setupId, actor.id))) {
          throw HttpError.forbidden('Only a shift lead assigned to this run’s setup can re-run its station logs at a stated offset.');
        }
        if (!run.stationBSha256) throw HttpError.conflict(`Run ${id} is one joined log: there are no two station records to pair at another offset.`);
        if ((run.stationOffset ?? 0) === offset) {
          throw HttpError.badRequest(`offset: run ${id} already pairs the records at offset ${offset}; state another offset`, 'offset');
        }
        const booking = run.bookingId === null ? null : await models.Booking.findByPk(run.bookingId, { transaction, lock: transaction.LOCK.UPDATE });
        const attempt = booking ? (await models.Run.count({ where: { bookingId: booking.id }, transaction })) + 1 : null;
        const realigned = await models.Run.create(
          {
            setupId: run.setupId,
            profileVersionId: run.profileVersionId,
            fileSha256: run.fileSha256,
            originalName: run.originalName,
            duplicateOf: run.id,
            uploadedBy: run.uploadedBy,
            uploadTokenId: run.uploadTokenId,
            notes: run.notes,
            mapping: run.mapping,
            bookingId: run.bookingId,
            attempt,
            replacementReason: booking ? `Re-run of run ${run.id} at offset ${offset}: ${reason}` : null,
            replayOf: null,
            acquiredOn: run.acquiredOn,
            // The same seed: the same rounds are tested, paired as stated; nobody draws again.
            seed: run.seed,
            stationBSha256: run.stationBSha256,
            stationBName: run.stationBName,
            stationOffset: offset,
            offsetReason: reason,
            stationGeometry: run.stationGeometry,
            realignedFrom: run.id,
          },
          { transaction },
        );
        await audit.record(
          { actorId: actor.id, action: 'run.realigned', targetType: 'run', targetId: realigned.id, details: { realignedFrom: run.id, offset, reason, attempt } },
          transaction,
        );
        await queue.enqueueAnalysis(realigned.id, transaction);
        return realigned.id;
      });
      return get(runId);
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
      add(AWAITING_SIGN_OFF, 'verdictStates', filter.awaitingSignOff ? VERDICT_STATES : undefined);
      const where = conditions.length > 0 ? `WHERE ${conditions.join(' AND ')}` : '';
      const order = `${SORT_COLUMNS[filter.sort]} ${filter.direction === 'asc' ? 'ASC' : 'DESC'} NULLS LAST, r.id DESC`;
      const rows = await sequelize.query<RunRow>(`${RUN_SELECT} ${where} ORDER BY ${order} LIMIT :limit OFFSET :offset`, {
        type: QueryTypes.SELECT,
        replacements: { ...replacements, limit: filter.pageSize, offset: filter.page * filter.pageSize },
      });
      const [{ total }] = await sequelize.query<{ total: string }>(`SELECT count(*) AS total FROM runs r ${where}`, { type: QueryTypes.SELECT, replacements });
      return { items: rows.map(toRunSummary), total: Number(total), page: filter.page, pageSize: filter.pageSize };
    },

    async signOff(id, { decision, comment }, actor) {
      return sequelize.transaction(async (transaction) => {
        const run = await models.Run.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
        if (!run) throw HttpError.notFound(`There is no run with id ${id}.`);
        if (!(await setups.isShiftLeadOf(run.setupId, actor.id))) {
          throw HttpError.forbidden('Only a shift lead assigned to this run’s setup can sign it off.');
        }
        const setup = (await models.Setup.findByPk(run.setupId, { transaction }))!;
        if (setup.fourEyes && run.uploadedBy === actor.id) {
          throw HttpError.forbidden(`You uploaded run ${id}; under the four-eyes rule of ${setup.name} another shift lead signs it off.`);
        }
        if (!VERDICT_STATES.includes(run.state)) {
          throw HttpError.conflict(`Run ${id} is ${run.state}; a run is signed off once its verdict is in.`);
        }
        if (await models.Withdrawal.findByPk(id, { transaction })) {
          throw HttpError.conflict(`Run ${id} was withdrawn as a mistaken upload; there is nothing to sign off.`);
        }
        if (decision === 'key-kept' && !(run.verdict === 'ACCEPT' && (run.result?.key?.finiteKeyBits ?? 0) > 0)) {
          const why = run.verdict === 'ACCEPT' ? 'its finite key is 0 bits at this size' : `its verdict is ${run.verdict}`;
          throw HttpError.badRequest(`No key can be kept from run ${id}: ${why}. Sign it off as key discarded or hardware action needed.`, 'decision');
        }
        if (await models.SignOff.findByPk(id, { transaction })) throw HttpError.conflict(`Run ${id} is already signed off.`);
        const signOff = await models.SignOff.create({ runId: id, userId: actor.id, decision, comment: comment.trim() }, { transaction });
        await audit.record(
          { actorId: actor.id, action: 'run.signed-off', targetType: 'run', targetId: id, details: { decision, comment: signOff.comment, verdict: run.verdict } },
          transaction,
        );
        return { userId: actor.id, userName: actor.name, decision, comment: signOff.comment, createdAt: signOff.createdAt.toISOString() };
      });
    },
  };
}

/** A log for a booking is of its night, and comes once its acquisition window has opened. */
function refuseOutsideBooking(booking: BookingRecord, newRun: Pick<NewRun, 'acquiredOn'>): void {
  if (newRun.acquiredOn !== undefined && newRun.acquiredOn !== booking.night) {
    throw HttpError.badRequest(`acquiredOn: booking ${booking.id} is the night of ${booking.night}, not ${newRun.acquiredOn}`, 'acquiredOn');
  }
  if (Date.now() < booking.windowStart.getTime()) {
    throw HttpError.conflict(`Booking ${booking.id}’s acquisition window opens at ${booking.windowStart.toISOString()}; its log comes after.`);
  }
}

/** A station's upload token uploads its station's own log only, never a joined log. */
function refuseJoinedFromStationToken(uploader: Uploader): void {
  if (uploader.kind === 'token' && uploader.token.station !== null) {
    throw HttpError.forbidden(`Upload token “${uploader.token.name}” is station ${uploader.token.station}'s: it uploads that station's own log (field station), not a joined log.`);
  }
}

/** The date that pairs an unbooked night's two station logs, which the upload must give. */
function unbookedNight(newRun: Pick<NewRun, 'acquiredOn'>): string {
  if (newRun.acquiredOn === undefined) {
    throw HttpError.badRequest('acquiredOn: the two station logs of an unbooked night are paired by their date; give the night the log was acquired', 'acquiredOn');
  }
  return newRun.acquiredOn;
}

/**
 * An upload is judged under its booking's profile version (unbooked: the setup's latest) and
 * nothing else: the uploader who could pick a looser profile could pick the verdict. Naming that
 * same profile or version is harmless; naming another is refused with why.
 */
function refuseChosenProfile(newRun: Omit<NewRun, 'log' | 'originalName'>, judgedAs: string, setupVersion: ProfileVersionRecord): void {
  const chosenOther =
    (newRun.profileId !== undefined && newRun.profileId !== setupVersion.profileId) || (newRun.profileVersionId !== undefined && newRun.profileVersionId !== setupVersion.id);
  if (!chosenOther) return;
  throw HttpError.forbidden(
    `Logs of ${judgedAs} are judged under the profile fixed for them (version ${setupVersion.version}); an upload cannot choose another. A shift lead or admin books a night under another profile, with a reason, before acquisition.`,
  );
}
