import { DOCUMENT } from '@angular/common';
import { HttpClient } from '@angular/common/http';
import { inject, Injectable, InjectionToken } from '@angular/core';
import { catchError, firstValueFrom, Observable, of } from 'rxjs';
import { Upload, type DetailedError, type HttpRequest, type HttpResponse, type HttpStack } from 'tus-js-client';

import { RESUMABLE_UPLOAD_PATH, type RunDto, type StationLogDto } from '@shared/api';
import { Session } from '../auth/session';
import { shouldRetryUpload, uploadFailure } from './upload-failure';
import { uploadMetadata, type LogUpload } from './upload-metadata';

/**
 * How far a resumable upload is: the share of the log the server holds, then the run it made, or
 * (a station's own log whose partner has not come yet) the station log waiting for the other station's.
 */
export type UploadProgress = { kind: 'sending'; fraction: number } | UploadArrival;

/** What a finished upload made: a run, or a station's log waiting for the other station's. */
export type UploadArrival = { kind: 'done'; run: RunDto } | { kind: 'waiting'; stationLog: StationLogDto };

/** The HTTP stack tus-js-client sends through: its own (the browser's XMLHttpRequest) unless a test gives one. */
export const RESUMABLE_HTTP_STACK = new InjectionToken<HttpStack | null>('RESUMABLE_HTTP_STACK', { providedIn: 'root', factory: () => null });

/**
 * Waits before each automatic retry, in ms: at once, then longer, about 45 s in all. A longer outage
 * ends the attempt with a message; uploading the same log again then goes on where it stopped.
 */
const RETRY_DELAYS_MS = [0, 1_000, 3_000, 10_000, 30_000];

/** A HEAD found the upload gone because it had finished: not a failure, it carries the run. */
class FinishedUpload extends Error {
  constructor(readonly run: RunDto) {
    super('The upload had already finished.');
  }
}

/**
 * Uploads a log to `/api/uploads` by the tus 1.0 protocol (tus-js-client): retried on a broken link
 * from the offset the server holds, resumed by a later attempt with the same file and fields, and
 * never sent twice when the last answer was lost (the finished upload names its run).
 */
@Injectable({ providedIn: 'root' })
export class ResumableUploads {
  private readonly http = inject(HttpClient);
  private readonly session = inject(Session);
  private readonly document = inject(DOCUMENT);
  private readonly httpStack = inject(RESUMABLE_HTTP_STACK);

  /** Sends the log; emits its progress, then what it made (a run, or a waiting station log), and completes. Unsubscribing pauses it. */
  send(log: LogUpload): Observable<UploadProgress> {
    return new Observable<UploadProgress>((subscriber) => {
      const metadata = uploadMetadata(log);
      const finish = (arrival: UploadArrival) => {
        subscriber.next(arrival);
        subscriber.complete();
      };
      const upload = new Upload(log.log, {
        endpoint: RESUMABLE_UPLOAD_PATH,
        metadata,
        headers: { Authorization: `Bearer ${this.session.token()}` },
        retryDelays: RETRY_DELAYS_MS,
        removeFingerprintOnSuccess: true,
        // Another user, or other fields (checked when the upload was made), start a new upload. No
        // hash: Web Crypto is missing where the page is not served over HTTPS.
        fingerprint: (file: File) => Promise.resolve(`bellkeep-${JSON.stringify([this.session.user()?.id, file.name, file.size, file.lastModified, metadata])}`),
        ...(this.httpStack ? { httpStack: this.httpStack } : {}),
        onProgress: (sent, total) => subscriber.next({ kind: 'sending', fraction: total > 0 ? sent / total : 0 }),
        onAfterResponse: (request, response) => this.noticeFinished(request, response),
        onShouldRetry: (error) => !(error.causingError instanceof FinishedUpload) && navigator.onLine && shouldRetryUpload(statusOf(error), bodyOf(error)),
        onSuccess: ({ lastResponse }) =>
          void this.arrivalAfter(lastResponse, upload.url).then((arrival) =>
            arrival ? finish(arrival) : subscriber.error(new Error('The log arrived, but the server named no run for it.')),
          ),
        onError: (error) => {
          const finished = 'causingError' in error ? error.causingError : null;
          if (finished instanceof FinishedUpload) finish({ kind: 'done', run: finished.run });
          else subscriber.error(uploadFailure(error));
        },
      });
      void upload.findPreviousUploads().then((previous) => {
        if (subscriber.closed) return;
        if (previous.length > 0) upload.resumeFromPreviousUpload(previous[0]);
        upload.start();
      });
      return () => void upload.abort();
    });
  }

  /**
   * What a completed upload made: in the last answer, or (when that answer carries none, as a HEAD
   * finding every byte already there does) the run the finished upload names.
   */
  private async arrivalAfter(lastResponse: HttpResponse, address: string | null): Promise<UploadArrival | null> {
    const arrival = arrivalIn(lastResponse);
    if (arrival !== null) return arrival;
    const run = address === null ? null : await this.finishedRun(address);
    return run === null ? null : { kind: 'done', run };
  }

  /**
   * When a HEAD finds the upload gone, asks whether it finished (its last answer lost): then the
   * run ends the upload instead of a second one with the same bytes.
   */
  private async noticeFinished(request: HttpRequest, response: HttpResponse): Promise<void> {
    if (request.getMethod() !== 'HEAD' || response.getStatus() !== 404) return;
    const run = await this.finishedRun(request.getURL());
    if (run) throw new FinishedUpload(run);
  }

  /** The run a finished upload made, or null: `GET` on its address (through HttpClient, so the session's token goes along). */
  private finishedRun(address: string): Promise<RunDto | null> {
    const path = new URL(address, this.document.baseURI).pathname;
    return firstValueFrom(this.http.get<RunDto>(path).pipe(catchError(() => of(null))));
  }
}

function statusOf(error: DetailedError): number {
  return error.originalResponse?.getStatus() ?? 0;
}

function bodyOf(error: DetailedError): string {
  return error.originalResponse?.getBody() ?? '';
}

/**
 * What the last PATCH's answer names: the run (201), or a station's log that waits for the other
 * station's (202, the night not yet a run); null when the answer carries neither.
 */
function arrivalIn(response: HttpResponse): UploadArrival | null {
  try {
    const body = JSON.parse(response.getBody()) as { id?: unknown } | null;
    if (typeof body?.id !== 'number') return null;
    return response.getStatus() === 202 ? { kind: 'waiting', stationLog: body as StationLogDto } : { kind: 'done', run: body as RunDto };
  } catch {
    return null;
  }
}
