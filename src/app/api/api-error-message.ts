import { HttpErrorResponse } from '@angular/common/http';

import type { ApiErrorBody } from '@shared/api';

/**
 * The sentence to show for a failed API call: the server's own message when the body has the
 * API's error shape, otherwise a plain sentence for the kind of failure.
 */
export function apiErrorMessage(error: unknown): string {
  if (!(error instanceof HttpErrorResponse)) {
    return 'Something went wrong in the app. Reload the page and try again.';
  }
  if (isApiErrorBody(error.error)) {
    return error.error.error.message;
  }
  if (error.status === 0) {
    return 'The Bellkeep server cannot be reached. Check your connection and try again.';
  }
  return `The server answered with status ${error.status}. Try again in a moment.`;
}

function isApiErrorBody(body: unknown): body is ApiErrorBody {
  const error = (body as Partial<ApiErrorBody> | null)?.error;
  return typeof error === 'object' && error !== null && typeof error.message === 'string';
}
