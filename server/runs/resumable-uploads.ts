import fs from 'node:fs';
import path from 'node:path';
import type { IncomingMessage } from 'node:http';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Router, type Request, type RequestHandler } from 'express';
import { FileStore } from '@tus/file-store';
import { Server, type Upload } from '@tus/server';
import type { Sequelize } from 'sequelize';
import { RESUMABLE_UPLOAD_PATH, type ApiErrorBody } from '@shared/api';
import { HttpError } from '../http/http-error';
import { validationError } from '../http/validate-body';
import type { LogStore } from '../storage/log-store';
import { uploaderKey } from '../upload-tokens/uploader';
import { diskFullAnswer, receiveUpload, type ReceivedRunLog } from './log-storage-engine';
import type { RunsService } from './runs.service';
import { uploadFieldsSchema, type UploadFields } from './upload-fields';
import { outcomeOfUploadKey, recordUploadOutcome, repeatAnswer } from './upload-keys';
import { bufferedFileStream } from '../storage/buffered-file-stream';

/** A resumable upload nobody finished is thrown away after a week. */
const ABANDONED_AFTER_MS = 7 * 86_400_000;
/** The metadata key that binds an upload to whoever created it. */
const UPLOADER_KEY = 'bellkeepUploader';

/** A refusal in the shape tus passes on to the client (its `status_code` and `body`): the API's JSON error body. */
class TusRefusal extends Error {
  constructor(
    readonly status_code: number,
    readonly body: string,
  ) {
    super(body);
  }
}

function tusError(error: HttpError): TusRefusal {
  const body: ApiErrorBody = { error: { code: error.code, message: error.message, ...(error.field ? { field: error.field } : {}) } };
  return new TusRefusal(error.status, JSON.stringify(body));
}

/**
 * The tus file store, with one change: a failed write rejects with its own error. FileStore 1.x
 * turns every write error into a bare 500, so a full disk could not say so. As there, the bytes
 * go to the upload's file at its offset, and what was written before a failure stays.
 */
class CauseKeepingFileStore extends FileStore {
  override async write(readable: IncomingMessage | Readable, id: string, offset: number): Promise<number> {
    const file = bufferedFileStream(path.join(this.directory, id), { flags: 'r+', start: offset });
    await pipeline(readable, file);
    return offset + file.bytesWritten;
  }
}

/** The upload's own fields, from its tus metadata (all values are text, as in a multipart form). */
function fieldsOf(upload: Upload): UploadFields {
  const { filename: _filename, [UPLOADER_KEY]: _uploader, ...metadata } = upload.metadata ?? {};
  const present = Object.fromEntries(Object.entries(metadata).filter((entry): entry is [string, string] => typeof entry[1] === 'string'));
  const parsed = uploadFieldsSchema.safeParse(present);
  if (!parsed.success) throw validationError(parsed.error);
  return parsed.data;
}

/**
 * `/api/uploads`: resumable uploads by the tus 1.0 protocol (@tus/server), for the acquisition
 * computer's curl recipe and the browser alike. A log of several GB over a flaky link goes on
 * where it broke off. The upload's fields travel as tus metadata and are checked when the upload
 * is created, so a refusal comes before the bytes; when the last byte is in, the file is streamed
 * into the archive (hashed on the way, as a multipart upload is) and becomes a run, whose JSON is
 * the answer to the last PATCH. A finished upload's id is kept, so asking again (GET) gives the
 * same run (or the station's log waiting for the other station's) and never a second one. Partial uploads wait under the data folder, also with S3.
 */
export function resumableUploads(deps: { sequelize: Sequelize; runs: RunsService; logStore: LogStore; uploader: RequestHandler; dataDir: string; limitBytes: number }): Router {
  const { sequelize, runs, logStore, uploader, limitBytes } = deps;
  const directory = path.join(deps.dataDir, 'resumable-uploads');
  fs.mkdirSync(directory, { recursive: true });
  const store = new CauseKeepingFileStore({ directory, expirationPeriodInMilliseconds: ABANDONED_AFTER_MS });
  const uploaderOf = (request: IncomingMessage) => (request as Request).uploader!;
  const finishedKey = (id: string) => `resumable:${id}`;

  async function forget(id: string): Promise<void> {
    await store.remove(id).catch(() => undefined);
  }

  const tus = new Server({
    path: RESUMABLE_UPLOAD_PATH,
    // "/api/uploads/<id>": right behind a TLS proxy too, where the Host and scheme seen here are not the client's.
    relativeLocation: true,
    datastore: store,
    maxSize: limitBytes,
    async onUploadCreate(request, response, upload) {
      try {
        const fields = fieldsOf(upload);
        await runs.refuseEarly(fields, uploaderOf(request));
      } catch (error) {
        if (error instanceof HttpError) throw tusError(error);
        throw error;
      }
      return { res: response, metadata: { ...upload.metadata, [UPLOADER_KEY]: uploaderKey(uploaderOf(request)) } };
    },
    async onIncomingRequest(request, _response, id) {
      if (request.method === 'POST' || request.method === 'OPTIONS') return;
      const upload = await store.getUpload(id).catch(() => null);
      // Somebody else's upload is not there for this uploader: the same answer as an unknown id.
      if (upload && upload.metadata?.[UPLOADER_KEY] !== uploaderKey(uploaderOf(request))) throw new TusRefusal(404, 'The file for this url was not found\n');
    },
    async onUploadFinish(request, response, upload) {
      const who = uploaderOf(request);
      let received: ReceivedRunLog | undefined;
      try {
        received = await receiveUpload(logStore, fs.createReadStream(path.join(directory, upload.id)));
        const { station, ...fields } = fieldsOf(upload);
        const named = { ...fields, originalName: upload.metadata?.filename ?? '', log: received };
        const arrival = station === undefined ? { run: await runs.create(named, who), stationLog: null } : await runs.receiveStationLog({ ...named, station }, who);
        const outcome = arrival.run === null ? { stationLogId: arrival.stationLog.id } : { runId: arrival.run.id };
        await recordUploadOutcome(sequelize, uploaderKey(who), finishedKey(upload.id), outcome);
        await forget(upload.id);
        // A station's log that waits for the other station's is accepted (202), not yet a run.
        const [status, body] = arrival.run === null ? [202, arrival.stationLog] : [201, arrival.run];
        return { res: response, status_code: status, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) };
      } catch (error) {
        if (!(error instanceof HttpError)) throw error;
        // Refused for good: the same bytes and fields would be refused again. Or the disk is full:
        // the finished upload holds the very space its copy into the archive needs, and a client
        // that finds its upload gone starts it again (tus-js-client does).
        await forget(upload.id);
        throw tusError(error);
      } finally {
        await received?.drop();
      }
    },
    // A full disk while a PATCH writes: a 507 in the API's words; the bytes written so far stay for the upload to go on.
    onResponseError(request, _response, error) {
      const answer = diskFullAnswer(error, request.method === 'PATCH' ? 'kept' : 'dropped');
      return answer instanceof HttpError ? tusError(answer) : undefined;
    },
  });
  void tus.cleanUpExpiredUploads().catch(() => undefined);

  const router = Router();
  router.use(uploader);
  // GET is not tus: it tells a client whose last answer was lost which run its finished upload made.
  router.get('/:id', async (request, response, next) => {
    if (request.method === 'HEAD') return next(); // Express routes HEAD to GET handlers; HEAD is tus's
    const outcome = await outcomeOfUploadKey(sequelize, uploaderKey(request.uploader!), finishedKey(String(request.params.id)));
    if (outcome === null) throw HttpError.notFound(`There is no finished upload ${request.params.id} of yours; ask its offset with HEAD and go on.`);
    const [status, body] = await repeatAnswer(runs, outcome);
    response.status(status).json(body);
  });
  router.use((request, response) => {
    request.url = request.originalUrl; // tus reads the upload id from the full path
    void tus.handle(request, response);
  });
  return router;
}
