import { DOCUMENT } from '@angular/common';
import { HttpClient } from '@angular/common/http';
import { inject, Injectable, InjectionToken } from '@angular/core';
import { catchError, firstValueFrom, Observable, of } from 'rxjs';
import { Upload, type DetailedError, type HttpRequest, type HttpResponse, type HttpStack } from 'tus-js-client';

import { RESUMABLE_UPLOAD_PATH, type RunDto } from '@shared/api';
import { Session } from '../auth/session';
import { shouldRetryUpload, uploadFailure } from './upload-failure';
import { uploadMetadata, type LogUpload } from './upload-metadata';

/** How far a resumable upload is: the share of the log the server holds, then the run it made. */
export type UploadProgress = { kind: 'sending'; fraction: number } | { kind: 'done'; run: RunDto };

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

  /** Sends the log; emits its progress, then the run it made, and completes. Unsubscribing pauses it. */
  send(log: LogUpload): Observable<UploadProgress> {
    return new Observable<UploadProgress>((subscriber) => {
      const metadata = uploadMetadata(log);
      const finish = (run: RunDto) => {
        subscriber.next({ kind: 'done', run });
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
          void this.runAfter(lastResponse, upload.url).then((run) => (run ? finish(run) : subscriber.error(new Error('The log arrived, but the server named no run for it.')))),
        onError: (error) => {
          const finished = 'causingError' in error ? error.causingError : null;
          if (finished instanceof FinishedUpload) finish(finished.run);
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
   * The run of a completed upload: in the last answer, or (when that answer carries none, as a HEAD
   * finding every byte already there does) what the finished upload names.
   */
  private async runAfter(lastResponse: HttpResponse, address: string | null): Promise<RunDto | null> {
    return runIn(lastResponse) ?? (address === null ? null : this.finishedRun(address));
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

/** The run in the last PATCH's answer, or null when the answer carries none. */
function runIn(response: HttpResponse): RunDto | null {
  try {
    const body = JSON.parse(response.getBody()) as Partial<RunDto> | null;
    return typeof body?.id === 'number' ? (body as RunDto) : null;
  } catch {
    return null;
  }
}
