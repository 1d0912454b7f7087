import type { DetailedError, HttpResponse } from 'tus-js-client';

import { apiErrorMessage } from '../api/api-error-message';
import { shouldRetryUpload, uploadFailure } from './upload-failure';

const refusal = (message: string) => JSON.stringify({ error: { code: 'conflict', message } });

/** A tus-js-client error as it comes: the request, and the answer if there was one. */
function failed(status: number | null, body = ''): DetailedError {
  const response: HttpResponse | null = status === null ? null : { getStatus: () => status, getHeader: () => undefined, getBody: () => body, getUnderlyingObject: () => null };
  return Object.assign(new Error('tus: failed to upload chunk at offset 0'), { originalRequest: {}, originalResponse: response, causingError: null }) as DetailedError;
}

describe('shouldRetryUpload', () => {
  it('tries again when the link broke off or the server failed', () => {
    expect(shouldRetryUpload(0, '')).toBe(true);
    expect(shouldRetryUpload(502, '<html>Bad gateway</html>')).toBe(true);
    expect(shouldRetryUpload(503, JSON.stringify({ error: { code: 'busy', message: 'Busy.' } }))).toBe(true);
  });

  it('tries again on tus’s own conflicts, which a fresh offset resolves', () => {
    expect(shouldRetryUpload(409, 'Upload-Offset header does not match current offset of file\n')).toBe(true);
    expect(shouldRetryUpload(423, '')).toBe(true);
  });

  it('stops at a refusal in the API’s words, which would come again', () => {
    expect(shouldRetryUpload(409, refusal('These bytes are already run 40: a log is judged once, under one seed.'))).toBe(false);
    expect(shouldRetryUpload(400, refusal('replacementReason: a replacement needs a reason'))).toBe(false);
    expect(shouldRetryUpload(401, refusal('Sign in again.'))).toBe(false);
    expect(shouldRetryUpload(404, 'The file for this url was not found\n')).toBe(false);
  });
});

describe('uploadFailure', () => {
  it('carries the server’s sentence to apiErrorMessage', () => {
    const error = uploadFailure(failed(409, refusal('These bytes are already run 40 (attempt 1 of this booking).')));
    expect(error).toMatchObject({ status: 409 });
    expect(apiErrorMessage(error)).toBe('These bytes are already run 40 (attempt 1 of this booking).');
  });

  it('says the server cannot be reached when there was no answer', () => {
    expect(apiErrorMessage(uploadFailure(failed(null)))).toBe('The Bellkeep server cannot be reached. Check your connection and try again.');
  });

  it('leaves the browser’s own failures as they are', () => {
    const unreadable = new Error('tus: cannot read the file');
    expect(uploadFailure(unreadable)).toBe(unreadable);
  });

  it('names the status of an answer in another shape', () => {
    expect(apiErrorMessage(uploadFailure(failed(413, 'Maximum size exceeded\n')))).toBe('The server answered with status 413. Try again in a moment.');
  });
});
