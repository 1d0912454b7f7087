import { DOCUMENT } from '@angular/common';
import { HttpClient, HttpErrorResponse, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { catchError, from, map, Observable, switchMap, throwError } from 'rxjs';

/**
 * The file name a `Content-Disposition: attachment` header gives, or `fallback` when it gives none.
 * The RFC 6266 `filename*` form (percent-encoded UTF-8) wins over plain `filename`, as browsers do;
 * any folder part is dropped so a name can never point outside the downloads folder.
 */
export function attachmentFileName(disposition: string | null, fallback: string): string {
  const name = disposition === null ? null : (extendedFileName(disposition) ?? plainFileName(disposition));
  const base = name?.split(/[\\/]/).pop()?.trim();
  return base ? base : fallback;
}

/** `filename*=UTF-8''r%C3%A9sum%C3%A9.pdf` → `résumé.pdf`. */
function extendedFileName(disposition: string): string | null {
  const value = /filename\*\s*=\s*([^;]+)/i.exec(disposition)?.[1].trim();
  const encoded = value === undefined ? undefined : /^[\w!#$%&+^`{}~-]+'[^']*'(.+)$/.exec(value)?.[1];
  if (encoded === undefined) return null;
  try {
    return decodeURIComponent(encoded);
  } catch {
    return null;
  }
}

/** `filename="run 12.json"` (backslash escapes undone) or `filename=run-12.json`. */
function plainFileName(disposition: string): string | null {
  const quoted = /filename\s*=\s*"((?:[^"\\]|\\.)*)"/i.exec(disposition)?.[1];
  if (quoted !== undefined) return quoted.replace(/\\(.)/g, '$1');
  return /filename\s*=\s*([^;\s]+)/i.exec(disposition)?.[1] ?? null;
}

/** How long a saved file's object URL lives after the click. */
const REVOKE_AFTER_MILLISECONDS = 10_000;

/** Downloads that need the session's token, so a plain link cannot fetch them. */
@Injectable({ providedIn: 'root' })
export class FileDownloads {
  private readonly http = inject(HttpClient);
  private readonly document = inject(DOCUMENT);

  /**
   * Fetches `url` through the HttpClient (the token goes with it) and hands the answer to the
   * browser as a download under the server's file name. Emits that name once saved.
   */
  save(url: string, fallbackName: string, params = new HttpParams()): Observable<string> {
    return this.http.get(url, { params, observe: 'response', responseType: 'blob' }).pipe(
      catchError(readErrorBody),
      map((response) => {
        const name = attachmentFileName(response.headers.get('Content-Disposition'), fallbackName);
        this.saveBlob(response.body ?? new Blob([]), name);
        return name;
      }),
    );
  }

  private saveBlob(blob: Blob, name: string): void {
    const address = URL.createObjectURL(blob);
    const link = this.document.createElement('a');
    link.href = address;
    link.download = name;
    link.hidden = true;
    this.document.body.append(link);
    link.click();
    link.remove();
    // The browser reads the object URL when the download begins, a moment after the click, so
    // revoking at once can cancel it; revoked a little later, the bytes are not held until the page closes.
    setTimeout(() => URL.revokeObjectURL(address), REVOKE_AFTER_MILLISECONDS);
  }
}

/**
 * A refused blob request carries the API's JSON error as a Blob: read it back into the error so
 * `apiErrorMessage` can show the server's own sentence.
 */
function readErrorBody(error: unknown): Observable<never> {
  if (!(error instanceof HttpErrorResponse) || !(error.error instanceof Blob)) return throwError(() => error);
  return from(error.error.text()).pipe(
    switchMap((text) => {
      let body: unknown = text;
      try {
        body = JSON.parse(text);
      } catch {
        // Not JSON: keep the text; the message then names the status.
      }
      const { headers, status, statusText } = error;
      return throwError(() => new HttpErrorResponse({ error: body, headers, status, statusText, url: error.url ?? undefined }));
    }),
  );
}
