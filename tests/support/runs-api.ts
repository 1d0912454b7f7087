import path from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import type { RunDto, SetupDto } from '../../shared/api';
import { FINISHED_STATES } from '../../shared/api';
import { PROJECT_ROOT } from '../../server/config/config';

/** A fixture log of fixtures/logs/. */
export function fixtureLog(name: string): string {
  return path.join(PROJECT_ROOT, 'fixtures', 'logs', name);
}

/** The id of the demo setup named `name`. */
export async function setupId(app: Express, token: string, name: string): Promise<number> {
  const response = await request(app).get('/api/setups').set('Authorization', `Bearer ${token}`).expect(200);
  return (response.body as SetupDto[]).find((setup) => setup.name === name)!.id;
}

/** Uploads a log through the API; `fields` are the form's other fields. */
export function uploadLog(app: Express, token: string, file: string, fields: Record<string, string | number>) {
  let call = request(app).post('/api/runs').set('Authorization', `Bearer ${token}`);
  for (const [name, value] of Object.entries(fields)) call = call.field(name, String(value));
  return call.attach('log', file);
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
