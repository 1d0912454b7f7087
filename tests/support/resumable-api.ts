import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import request from 'supertest';

/** The protocol header every tus request but OPTIONS carries. */
const TUS = { 'Tus-Resumable': '1.0.0' };

/** tus metadata: each field as its name and its value in base64, comma-separated. */
function tusMetadata(fields: Record<string, string | number>): string {
  return Object.entries(fields)
    .map(([name, value]) => `${name} ${Buffer.from(String(value)).toString('base64')}`)
    .join(',');
}

/** Creates a resumable upload of `length` bytes with the upload's fields as metadata; returns its path, `/api/uploads/<id>`. */
export async function createResumableUpload(app: Express, token: string, length: number, fields: Record<string, string | number>): Promise<string> {
  const created = await request(app)
    .post('/api/uploads')
    .set({ Authorization: `Bearer ${token}`, ...TUS, 'Upload-Length': String(length), 'Upload-Metadata': tusMetadata(fields) })
    .expect(201);
  return created.headers['location'];
}

/** Sends `bytes` at `offset` of the upload (one PATCH); the answer. */
export function patchUpload(app: Express, token: string, location: string, offset: number, bytes: Buffer) {
  return request(app)
    .patch(location)
    .set({ Authorization: `Bearer ${token}`, ...TUS, 'Upload-Offset': String(offset), 'Content-Type': 'application/offset+octet-stream' })
    .send(bytes);
}

/** The upload's offset as HEAD gives it, with the status (404 once the upload is gone). */
export async function uploadOffset(app: Express, token: string, location: string): Promise<{ status: number; offset: number | null }> {
  const head = await request(app)
    .head(location)
    .set({ Authorization: `Bearer ${token}`, ...TUS });
  const offset = head.headers['upload-offset'];
  return { status: head.status, offset: offset === undefined ? null : Number(offset) };
}

/**
 * A PATCH over a real socket that promises all of `bytes` and sends only the first half;
 * `beforeBreaking` runs while the server holds the open request, then the socket is destroyed.
 */
export async function breakOffPatch(app: Express, token: string, location: string, bytes: Buffer, beforeBreaking: () => Promise<unknown>): Promise<void> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;
  const outgoing = http.request({
    host: '127.0.0.1',
    port,
    method: 'PATCH',
    path: location,
    headers: { Authorization: `Bearer ${token}`, ...TUS, 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream', 'Content-Length': String(bytes.length) },
  });
  outgoing.on('error', () => undefined);
  outgoing.write(bytes.subarray(0, bytes.length >> 1));
  await beforeBreaking();
  outgoing.destroy();
  await new Promise((resolve) => server.close(resolve));
}
