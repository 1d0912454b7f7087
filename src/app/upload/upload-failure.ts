import { HttpErrorResponse } from '@angular/common/http';
import type { DetailedError } from 'tus-js-client';

import type { ApiErrorBody } from '@shared/api';

/** The server's answer as JSON, or the text itself when it is not JSON. */
function parsedBody(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

/** Whether a body is the API's error shape: a refusal in the server's words. */
function isApiError(body: unknown): body is ApiErrorBody {
  return typeof (body as Partial<ApiErrorBody> | null)?.error?.message === 'string';
}

/**
 * Whether a failed request of a resumable upload is worth another try: no answer (the link broke
 * off), the server busy or failing (5xx), or tus's own 409 and 423 (offset out of step, upload
 * locked), which a fresh HEAD resolves. A refusal in the API's words is final: the same upload
 * would be refused again.
 */
export function shouldRetryUpload(status: number, body: string): boolean {
  if (status === 0 || status >= 500) return true;
  return (status === 409 || status === 423) && !isApiError(parsedBody(body));
}

/**
 * A failed resumable upload as an HttpErrorResponse, so `apiErrorMessage` words it as any other API
 * failure; an error of the browser's own (the file could not be read) stays as it is.
 */
export function uploadFailure(error: Error | DetailedError): HttpErrorResponse | Error {
  if (!('originalRequest' in error) || !error.originalRequest) return error;
  const response = error.originalResponse;
  if (response === null) return new HttpErrorResponse({ status: 0, statusText: error.message });
  return new HttpErrorResponse({ status: response.getStatus(), error: parsedBody(response.getBody() ?? '') });
}
