import type { ApiErrorCode } from '@shared/api';

/** The one error type of the server: the error handler turns it into an `ApiErrorBody`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'HttpError';
  }

  static badRequest(message: string, field?: string): HttpError {
    return new HttpError(400, 'validation', message, field);
  }

  static unauthorized(message = 'Sign in first: this needs a valid, unexpired token.'): HttpError {
    return new HttpError(401, 'unauthorized', message);
  }

  static forbidden(message: string): HttpError {
    return new HttpError(403, 'forbidden', message);
  }

  static notFound(message: string): HttpError {
    return new HttpError(404, 'not-found', message);
  }

  static conflict(message: string, field?: string): HttpError {
    return new HttpError(409, 'conflict', message, field);
  }

  /** 507 Insufficient Storage (RFC 4918, section 11.5): the server's disk is full, which no change to the request mends. */
  static insufficientStorage(message: string): HttpError {
    return new HttpError(507, 'insufficient-storage', message);
  }
}

/** Whether a file system call failed for a full disk or an exhausted disk quota (POSIX ENOSPC, EDQUOT). */
export function isDiskFull(error: unknown): boolean {
  const code = (error as NodeJS.ErrnoException | null | undefined)?.code;
  return code === 'ENOSPC' || code === 'EDQUOT';
}
