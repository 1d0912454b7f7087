import crypto from 'node:crypto';
import http from 'node:http';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { RunDto } from '@shared/api';
import { LOG_FIELD } from '@server/runs/upload-middleware';

export interface UploadOutcome {
  run: RunDto;
  /** Bytes of the log (the file part only). */
  logBytes: number;
  /** performance.now() just before the first byte was sent, and when the 201 arrived. */
  startedAt: number;
  answeredAt: number;
}

/**
 * `POST /api/runs` with a multipart body written as it goes (chunked transfer encoding): the form
 * fields, then the log from `chunks`, so the log is never whole in memory or on disk here. Resolves
 * on the 201 with the new run; any other answer fails with its body.
 */
export async function uploadStreamedLog(apiUrl: string, token: string, fields: Record<string, string>, chunks: Iterable<Buffer>): Promise<UploadOutcome> {
  const boundary = `bellkeep-bench-${crypto.randomBytes(12).toString('hex')}`;
  let logBytes = 0;
  function* body(): Generator<Buffer> {
    for (const [name, value] of Object.entries(fields)) {
      yield Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`);
    }
    yield Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="${LOG_FIELD}"; filename="bench.csv"\r\nContent-Type: text/csv\r\n\r\n`);
    for (const chunk of chunks) {
      logBytes += chunk.length;
      yield chunk;
    }
    yield Buffer.from(`\r\n--${boundary}--\r\n`);
  }

  const startedAt = performance.now();
  const request = http.request(`${apiUrl}/api/runs`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': `multipart/form-data; boundary=${boundary}` },
  });
  const answer = new Promise<{ status: number; text: string; answeredAt: number }>((resolve, reject) => {
    request.once('response', (response) => {
      const answeredAt = performance.now();
      let text = '';
      response.setEncoding('utf8');
      response.on('data', (part: string) => (text += part));
      response.once('end', () => resolve({ status: response.statusCode ?? 0, text, answeredAt }));
      response.once('error', reject);
    });
    request.once('error', reject);
  });
  // A server that refuses early answers before the body is through; its answer says why.
  const sent = pipeline(Readable.from(body(), { objectMode: false }), request).catch((error: unknown) => error);
  const { status, text, answeredAt } = await answer;
  const sendError = await sent;
  if (status !== 201) throw new Error(`The upload was answered ${status}: ${text}`);
  if (sendError) throw sendError instanceof Error ? sendError : new Error('the upload could not be sent');
  return { run: JSON.parse(text) as RunDto, logBytes, startedAt, answeredAt };
}
