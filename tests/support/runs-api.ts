import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import type { BookingDto, RunDto, SetupDto } from '@shared/api';
import { FINISHED_STATES } from '@shared/api';
import { PROJECT_ROOT } from '@server/config/config';

/** A fixture log of fixtures/logs/. */
export function fixtureLog(name: string): string {
  return path.join(PROJECT_ROOT, 'fixtures', 'logs', name);
}

/** The id of the demo setup named `name`. */
export async function setupId(app: Express, token: string, name: string): Promise<number> {
  const response = await request(app).get('/api/setups').set('Authorization', `Bearer ${token}`).expect(200);
  return (response.body as SetupDto[]).find((setup) => setup.name === name)!.id;
}

/** A log in memory, with the file name its upload carries. */
export interface LogBytes {
  bytes: Buffer;
  name: string;
}

/** Books `night` of a setup with its acquisition window open now (from a minute ago, for an hour). */
export async function bookOpenNight(app: Express, token: string, fields: { setupId: number; night: string; plannedRounds: number }): Promise<BookingDto> {
  const now = Date.now();
  const answer = await request(app)
    .post('/api/bookings')
    .set('Authorization', `Bearer ${token}`)
    .send({ ...fields, windowStart: new Date(now - 60_000).toISOString(), windowEnd: new Date(now + 3_600_000).toISOString() })
    .expect(201);
  return answer.body as BookingDto;
}

/** Uploads a log through the API, from a file or from memory; `fields` are the form's other fields. */
export function uploadLog(app: Express, token: string, file: string | LogBytes, fields: Record<string, string | number>) {
  let call = request(app).post('/api/runs').set('Authorization', `Bearer ${token}`);
  for (const [name, value] of Object.entries(fields)) call = call.field(name, String(value));
  if (typeof file === 'string') return call.attach('log', file);
  // form-data sends a `filepath` as written (normalised), but cuts a `filename` to its base name
  // before it leaves; superagent's types know only `filename`.
  return call.attach('log', file.bytes, { filepath: file.name } as { filename?: string });
}

/** Polls the run until its analysis is over; returns it. */
export async function waitForFinishedRun(app: Express, token: string, id: number, timeoutMs = 30_000): Promise<RunDto> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const run = (await request(app).get(`/api/runs/${id}`).set('Authorization', `Bearer ${token}`).expect(200)).body as RunDto;
    if (FINISHED_STATES.includes(run.state)) return run;
    if (Date.now() > deadline) throw new Error(`Run ${id} still ${run.state} after ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

export interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  html: string;
  to: Array<{ address: string }>;
  messageId: string;
  /** The mail's headers by lower-case name, as the catcher parsed them (`message-id` among them). */
  headers: Record<string, string>;
}

/** Every mail in the catcher's inbox. */
export async function inbox(inboxUrl: string): Promise<CaughtMail[]> {
  return (await (await fetch(`${inboxUrl}/api/email`)).json()) as CaughtMail[];
}

/** Waits until a mail with this subject is in the inbox. */
export async function waitForMail(inboxUrl: string, subject: string, timeoutMs = 20_000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await inbox(inboxUrl)).find((mail) => mail.subject === subject);
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`No mail "${subject}" after ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/**
 * An upload over a real socket, broken off half-way: the form's `setupId`, then `logStart` as the
 * beginning of the log; `beforeBreaking` runs while the server holds the open request.
 */
export async function breakOffUpload(app: Express, token: string, setupId: number, logStart: string, beforeBreaking: () => Promise<unknown>): Promise<void> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;
  const boundary = 'bellkeep-boundary';
  const outgoing = http.request({
    host: '127.0.0.1',
    port,
    method: 'POST',
    path: '/api/runs',
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': `multipart/form-data; boundary=${boundary}` },
  });
  outgoing.on('error', () => undefined);
  outgoing.write(`--${boundary}\r\nContent-Disposition: form-data; name="setupId"\r\n\r\n${setupId}\r\n`);
  outgoing.write(`--${boundary}\r\nContent-Disposition: form-data; name="log"; filename="night.csv"\r\nContent-Type: text/csv\r\n\r\nround,x,y,a,b\n`);
  outgoing.write(logStart);
  await beforeBreaking();
  outgoing.destroy();
  await new Promise((resolve) => server.close(resolve));
}
