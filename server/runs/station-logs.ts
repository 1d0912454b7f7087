import type { Transaction, WhereOptions } from 'sequelize';
import { type ColumnMapping, STATION_MAPPING_RULE, stationLogOutcomes } from '@shared/analysis';
import { otherStation, type SetupDto, type StationGeometryDto, type StationLogDto, type StationName } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import { uploaderInTrail, type Uploader } from '../upload-tokens/uploader';
import type { ReceivedRunLog } from './log-storage-engine';
import type { StationLogRecord } from './run.model';

/** One night of a setup: its booking, or unbooked its date. */
export interface StationNight {
  setupId: number;
  bookingId: number | null;
  acquiredOn: string | null;
}

/** A station's log as it arrives. */
export interface StationUpload extends StationNight {
  station: StationName;
  newRun: { originalName: string; notes?: string; log: ReceivedRunLog };
  mapping: Record<string, unknown> | null;
  uploader: Uploader;
}

export interface StationLogs {
  /**
   * Records a station's log of a night. A later log of the same station and night supersedes the
   * one still waiting (kept, and marked so in the trail); the same bytes again are the same log.
   */
  arrive(upload: StationUpload, transaction: Transaction): Promise<StationLogRecord>;
  /** The other station's log of the same night still waiting for its partner, if any. */
  waitingPartner(log: StationLogRecord, transaction: Transaction): Promise<StationLogRecord | null>;
  get(id: number): Promise<StationLogDto>;
  list(filter: { setupId?: number; waiting?: boolean }): Promise<StationLogDto[]>;
}

/** Station logs waiting for their partner, and those already joined into runs (`station_logs`). */
export function createStationLogs(models: Models, audit: AuditTrail): StationLogs {
  const { StationLog } = models;

  const waitingOf = (night: StationNight, station: StationName, transaction: Transaction) =>
    StationLog.findOne({
      where: { setupId: night.setupId, bookingId: night.bookingId, acquiredOn: night.acquiredOn, station, runId: null, supersededBy: null },
      transaction,
    });

  async function toDtos(records: StationLogRecord[]): Promise<StationLogDto[]> {
    const [files, people, tokens] = await Promise.all([
      models.ArchiveFile.findAll({ where: { sha256: records.map((record) => record.fileSha256) } }),
      models.User.findAll({ where: { id: records.flatMap((record) => record.uploadedBy ?? []) } }),
      models.UploadToken.findAll({ where: { id: records.flatMap((record) => record.uploadTokenId ?? []) } }),
    ]);
    return records.map((record) => ({
      id: record.id,
      setupId: record.setupId,
      station: record.station,
      bookingId: record.bookingId,
      acquiredOn: record.acquiredOn,
      sha256: record.fileSha256,
      bytes: files.find((file) => file.sha256 === record.fileSha256)?.bytes ?? 0,
      originalName: record.originalName,
      uploadedBy:
        record.uploadedBy !== null
          ? (people.find((person) => person.id === record.uploadedBy)?.name ?? '')
          : `upload token “${tokens.find((token) => token.id === record.uploadTokenId)?.name ?? ''}”`,
      createdAt: record.createdAt.toISOString(),
      runId: record.runId ?? null,
      supersededBy: record.supersededBy ?? null,
    }));
  }

  return {
    async arrive(upload, transaction) {
      const { station, newRun, uploader } = upload;
      const waiting = await waitingOf(upload, station, transaction);
      if (waiting?.fileSha256 === newRun.log.sha256) return waiting;
      const log = await StationLog.create(
        {
          setupId: upload.setupId,
          station,
          bookingId: upload.bookingId,
          acquiredOn: upload.acquiredOn,
          fileSha256: newRun.log.sha256,
          originalName: [...newRun.originalName].slice(0, 255).join(''),
          uploadedBy: uploader.kind === 'person' ? uploader.user.id : null,
          uploadTokenId: uploader.kind === 'token' ? uploader.token.id : null,
          notes: newRun.notes ?? '',
          mapping: upload.mapping,
        },
        { transaction },
      );
      if (waiting) await waiting.update({ supersededBy: log.id }, { transaction });
      const trail = uploaderInTrail(uploader);
      await audit.record(
        {
          actorId: trail.actorId,
          action: 'station-log.uploaded',
          targetType: 'setup',
          targetId: upload.setupId,
          details: {
            ...trail.details,
            stationLogId: log.id,
            station,
            sha256: log.fileSha256,
            bytes: newRun.log.bytes,
            bookingId: upload.bookingId,
            acquiredOn: upload.acquiredOn,
            supersedes: waiting?.id ?? null,
          },
        },
        transaction,
      );
      return log;
    },

    waitingPartner(log, transaction) {
      return waitingOf(log, otherStation(log.station), transaction);
    },

    async get(id) {
      const record = await StationLog.findByPk(id);
      if (!record) throw HttpError.notFound(`There is no station log with id ${id}.`);
      return (await toDtos([record]))[0];
    },

    async list({ setupId, waiting }) {
      const where: WhereOptions<StationLogRecord> = {
        ...(setupId === undefined ? {} : { setupId }),
        ...(waiting ? { runId: null, supersededBy: null } : {}),
      };
      return toDtos(await StationLog.findAll({ where, order: [['id', 'DESC']], limit: 200 }));
    },
  };
}

/** The station an upload is for: the field's; a station's upload token uploads its own station's log only. */
export function stationOfUpload(station: StationName, uploader: Uploader): StationName {
  if (uploader.kind === 'token' && uploader.token.station !== null && uploader.token.station !== station) {
    throw HttpError.forbidden(`Upload token “${uploader.token.name}” is station ${uploader.token.station}'s: it uploads that station's own log, not station ${station}'s.`);
  }
  return station;
}

/**
 * A station log's mapping: station logs are read by their own column names (A: round, x, a; B:
 * round, y, b, with t_setting and t_outcome), so a mapping may only say how outcomes are written.
 */
export function stationMapping(mapping: ColumnMapping | undefined): Record<string, unknown> | null {
  if (mapping === undefined) return null;
  const outcomes = stationLogOutcomes(mapping);
  if (outcomes === null) throw HttpError.badRequest(`mapping: ${STATION_MAPPING_RULE}`, 'mapping');
  return { outcomes };
}

/** The pair's mapping: the outcome encoding both stations' uploads named (one named alone counts for both). */
export function pairMapping(a: StationLogRecord, b: StationLogRecord): Record<string, unknown> | null {
  const [first, second] = [a.mapping?.outcomes as string | undefined, b.mapping?.outcomes as string | undefined];
  if (first !== undefined && second !== undefined && first !== second) {
    throw HttpError.badRequest(`mapping: station A's log names outcomes written ${first}, station B's ${second}; a night's two logs are read one way`, 'mapping');
  }
  return a.mapping ?? b.mapping;
}

/** The setup's distance and clock offset, when it records both (the timing check needs both), for the run to keep. */
export function setupGeometry(setup: Pick<SetupDto, 'stationDistanceM' | 'clockOffsetNs' | 'clockUncertaintyNs'>): StationGeometryDto | null {
  const { stationDistanceM, clockOffsetNs, clockUncertaintyNs } = setup;
  if (stationDistanceM === null || clockOffsetNs === null || clockUncertaintyNs === null) return null;
  return { stationDistanceM, clockOffsetNs, clockUncertaintyNs };
}
