import type { Request, RequestHandler, Response } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import { HttpError } from '../http/http-error';
import { uploaderKey } from '../upload-tokens/uploader';
import type { RunsService } from './runs.service';

/** The request header that makes an upload idempotent (the name of the IETF HTTP draft). */
export const IDEMPOTENCY_HEADER = 'Idempotency-Key';

/** Reads and drops the rest of a request's body, so an early answer reaches a client still sending. */
function drained(request: Request): Promise<void> {
  return new Promise((resolve) => {
    if (request.readableEnded) return resolve();
    request.once('end', resolve).once('close', resolve).resume();
  });
}

/** What an uploader's finished upload made: a run, or a station's log waiting for the other station's. */
export type UploadOutcome = { runId: number } | { stationLogId: number };

/** What an uploader's key's upload made, or null (no such key, or its upload is still being received). */
export async function outcomeOfUploadKey(sequelize: Sequelize, uploader: string, key: string): Promise<UploadOutcome | null> {
  const [row] = await sequelize.query<{ run_id: number | null; station_log_id: number | null }>(
    'SELECT run_id, station_log_id FROM upload_keys WHERE uploader = :uploader AND idempotency_key = :key',
    { replacements: { uploader, key }, type: QueryTypes.SELECT },
  );
  if (row?.run_id != null) return { runId: row.run_id };
  if (row?.station_log_id != null) return { stationLogId: row.station_log_id };
  return null;
}

/** Records what a finished upload made under its key (a key claimed before the upload, or a resumable upload's id). */
export async function recordUploadOutcome(sequelize: Sequelize, uploader: string, key: string, outcome: UploadOutcome): Promise<void> {
  const [runId, stationLogId] = 'runId' in outcome ? [outcome.runId, null] : [null, outcome.stationLogId];
  await sequelize.query(
    `INSERT INTO upload_keys (uploader, idempotency_key, run_id, station_log_id) VALUES (:uploader, :key, :runId, :stationLogId)
     ON CONFLICT (uploader, idempotency_key) DO UPDATE SET run_id = :runId, station_log_id = :stationLogId`,
    { replacements: { uploader, key, runId, stationLogId } },
  );
}

/**
 * The answer to a repeat of a finished upload, as the first one was answered: the run it made
 * (200, as it stands now), or the station's log it made (202: waiting for the other station's log,
 * or, with its `runId`, joined into a run since).
 */
export async function repeatAnswer(runs: RunsService, outcome: UploadOutcome): Promise<[number, unknown]> {
  return 'runId' in outcome ? [200, await runs.get(outcome.runId)] : [202, await runs.stationLog(outcome.stationLogId)];
}

/** Visible ASCII, 1 to 200 characters: room for a UUID or a client's own scheme. */
const KEY_PATTERN = /^[\x21-\x7e]{1,200}$/;

interface ClaimedKey {
  uploader: string;
  key: string;
  /** Set once the upload made a run or a station's log, so the claim is kept when the response closes. */
  outcome?: UploadOutcome;
}

/**
 * Idempotent uploads: with an `Idempotency-Key` header, the first request claims the key (one
 * INSERT, so two requests at the same moment cannot both win) before any byte is read; a repeat
 * gets what the key's upload made (`repeatAnswer`), or 409 while the first is still being received.
 * A request that ends without a run or a station's log gives its key back, so the client's retry can
 * try again.
 */
export function uploadKeys(sequelize: Sequelize, runs: RunsService) {
  const claims = new WeakMap<Response, ClaimedKey>();

  const middleware: RequestHandler = async (request, response, next) => {
    const key = request.get(IDEMPOTENCY_HEADER);
    if (key === undefined) return next();
    if (!KEY_PATTERN.test(key)) {
      await drained(request);
      throw HttpError.badRequest('must be 1 to 200 visible ASCII characters', IDEMPOTENCY_HEADER);
    }
    const uploader = uploaderKey(request.uploader!);
    const replacements = { uploader, key };
    const claimed = await sequelize.query('INSERT INTO upload_keys (uploader, idempotency_key) VALUES (:uploader, :key) ON CONFLICT DO NOTHING RETURNING uploader', {
      replacements,
      type: QueryTypes.SELECT,
    });
    if (claimed.length === 1) {
      claims.set(response, { uploader, key });
      // Failures before the route runs (a broken-off or too large upload) give the key back here.
      response.on('close', () => void release(response));
      return next();
    }
    await drained(request); // the repeat's bytes are not needed, but a client still sending them must not see a broken pipe
    const existing = await outcomeOfUploadKey(sequelize, uploader, key);
    if (existing !== null) {
      const [status, body] = await repeatAnswer(runs, existing);
      response.status(status).json(body);
      return;
    }
    throw HttpError.conflict('An upload with this Idempotency-Key is still being received; ask again once it has finished.', IDEMPOTENCY_HEADER);
  };

  /** Points the response's claimed key, if any, at what its upload made. */
  async function record(response: Response, outcome: UploadOutcome): Promise<void> {
    const claim = claims.get(response);
    if (!claim) return;
    claim.outcome = outcome;
    await recordUploadOutcome(sequelize, claim.uploader, claim.key, outcome);
  }

  /** Gives the response's claimed key back unless its upload made something, so a retry can use it. */
  async function release(response: Response): Promise<void> {
    const claim = claims.get(response);
    if (!claim || claim.outcome !== undefined) return;
    claims.delete(response);
    await sequelize.query('DELETE FROM upload_keys WHERE uploader = :uploader AND idempotency_key = :key AND run_id IS NULL AND station_log_id IS NULL', {
      replacements: { uploader: claim.uploader, key: claim.key },
    });
  }

  return { middleware, record, release };
}
