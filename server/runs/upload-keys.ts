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

/** The run an uploader's key made, or null (no such key, or its upload is still being received). */
export async function runOfUploadKey(sequelize: Sequelize, uploader: string, key: string): Promise<number | null> {
  const [row] = await sequelize.query<{ run_id: number | null }>('SELECT run_id FROM upload_keys WHERE uploader = :uploader AND idempotency_key = :key', {
    replacements: { uploader, key },
    type: QueryTypes.SELECT,
  });
  return row?.run_id ?? null;
}

/** Visible ASCII, 1 to 200 characters: room for a UUID or a client's own scheme. */
const KEY_PATTERN = /^[\x21-\x7e]{1,200}$/;

interface ClaimedKey {
  uploader: string;
  key: string;
  /** Set once the run exists, so the claim is kept when the response closes. */
  runId?: number;
}

/**
 * Idempotent uploads: with an `Idempotency-Key` header, the first request claims the key (one
 * INSERT, so two requests at the same moment cannot both win) before any byte is read; a repeat
 * gets the run the key made (200), or 409 while the first is still being received. A request that
 * ends without a run gives its key back, so the client's retry can try again.
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
    const existing = await runOfUploadKey(sequelize, uploader, key);
    if (existing !== null) {
      response.status(200).json(await runs.get(existing));
      return;
    }
    throw HttpError.conflict('An upload with this Idempotency-Key is still being received; ask again once it has finished.', IDEMPOTENCY_HEADER);
  };

  /** Points the response's claimed key, if any, at the run it made. */
  async function recordRun(response: Response, runId: number): Promise<void> {
    const claim = claims.get(response);
    if (!claim) return;
    claim.runId = runId;
    await sequelize.query('UPDATE upload_keys SET run_id = :runId WHERE uploader = :uploader AND idempotency_key = :key', {
      replacements: { runId, uploader: claim.uploader, key: claim.key },
    });
  }

  /** Gives the response's claimed key back unless it made a run, so a retry can use it. */
  async function release(response: Response): Promise<void> {
    const claim = claims.get(response);
    if (!claim || claim.runId !== undefined) return;
    claims.delete(response);
    await sequelize.query('DELETE FROM upload_keys WHERE uploader = :uploader AND idempotency_key = :key AND run_id IS NULL', {
      replacements: { uploader: claim.uploader, key: claim.key },
    });
  }

  return { middleware, recordRun, release };
}
