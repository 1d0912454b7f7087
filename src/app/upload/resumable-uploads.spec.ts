import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { HttpRequest, HttpResponse, HttpStack } from 'tus-js-client';

import type { RunDto, StationLogDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { RESUMABLE_HTTP_STACK, ResumableUploads, type UploadProgress } from './resumable-uploads';
import type { LogUpload } from './upload-metadata';
import { signInAs } from '../../testing/sign-in-as';

// The package's "browser" build, which the app's build picks; jest would take its Node build.
jest.mock('tus-js-client', () => jest.requireActual<object>('tus-js-client/lib.es5/browser/index.js'));

/** The clock's own setTimeout, kept before the fake timers replace it. */
const realSetTimeout = setTimeout;

const LOG = 'round,x,y,a,b\n1,0,1,0,0\n2,1,1,1,0\n3,0,0,1,1\n';
const RUN = { id: 41, state: 'queued' } as RunDto;
/** Station A's log of a night whose station B log has not come yet. */
const WAITING_LOG = { id: 5, setupId: 2, station: 'A', bookingId: 7, runId: null, supersededBy: null } as StationLogDto;
const UPLOAD_URL = 'http://localhost/api/uploads/u1';

/** One request as the fake server saw it. */
interface Seen {
  method: string;
  url: string;
  headers: Record<string, string>;
  bytes: number;
}

/**
 * Just enough of the server's tus endpoint, behind tus-js-client's HTTP stack interface. `cutAfter`
 * breaks the next PATCH off once the server holds that many bytes, and with `downAfterCut` the link
 * stays down; `down` makes every request fail without an answer; `loseLastAnswer` drops the answer of the PATCH that completes the upload;
 * `refuseAtFinish` refuses the complete log in the API's words; `waitsForPartner` answers the
 * complete log as a station's log waiting for the other station's (202).
 */
class FakeTus implements HttpStack {
  readonly seen: Seen[] = [];
  cutAfter: number | null = null;
  downAfterCut = false;
  down = false;
  loseLastAnswer = false;
  refuseAtFinish: string | null = null;
  waitsForPartner = false;
  offset = 0;
  length = 0;
  finished = false;

  getName(): string {
    return 'fake tus';
  }

  createRequest(method: string, url: string): HttpRequest {
    const headers: Record<string, string> = {};
    return {
      getMethod: () => method,
      getURL: () => url,
      setHeader: (name, value) => (headers[name] = value),
      getHeader: (name) => headers[name],
      setProgressHandler: () => undefined,
      // A throw in the executor rejects: a network failure of the fake.
      send: (body: Blob | null) => new Promise<HttpResponse>((resolve) => resolve(this.answer(method, url, headers, body))),
      abort: () => Promise.resolve(),
      getUnderlyingObject: () => null,
    };
  }

  private answer(method: string, url: string, headers: Record<string, string>, body: Blob | null): HttpResponse {
    this.seen.push({ method, url, headers, bytes: body?.size ?? 0 });
    if (this.down) throw new Error('network down');
    if (method === 'POST') {
      this.length = Number(headers['Upload-Length']);
      this.offset = 0;
      return reply(201, { Location: UPLOAD_URL });
    }
    if (this.finished) return reply(404, {}, 'The file for this url was not found\n');
    if (method === 'HEAD') return reply(200, { 'Upload-Offset': String(this.offset), 'Upload-Length': String(this.length) });
    const arriving = body?.size ?? 0;
    if (this.cutAfter !== null) {
      this.offset += Math.min(arriving, this.cutAfter - this.offset);
      this.cutAfter = null;
      this.down = this.downAfterCut;
      throw new Error('connection reset');
    }
    this.offset += arriving;
    if (this.offset < this.length) return reply(204, { 'Upload-Offset': String(this.offset) });
    this.finished = true;
    if (this.refuseAtFinish) return reply(409, {}, JSON.stringify({ error: { code: 'conflict', message: this.refuseAtFinish } }));
    if (this.loseLastAnswer) throw new Error('connection reset');
    if (this.waitsForPartner) return reply(202, { 'Upload-Offset': String(this.offset) }, JSON.stringify(WAITING_LOG));
    return reply(201, { 'Upload-Offset': String(this.offset) }, JSON.stringify(RUN));
  }
}

function reply(status: number, headers: Record<string, string>, body = ''): HttpResponse {
  return { getStatus: () => status, getHeader: (name) => headers[name], getBody: () => body, getUnderlyingObject: () => null };
}

describe('ResumableUploads', () => {
  let server: FakeTus;
  let http: HttpTestingController;
  const file = new File([LOG], 'night-14.csv', { type: 'text/csv', lastModified: 1_773_500_000_000 });
  const log: LogUpload = {
    log: file,
    setupId: 2,
    mapping: { columns: {}, outcomes: '0/1' },
    bookingId: 7,
    replacementReason: '',
    acquiredOn: '',
    notes: 'Detector B realigned at 23:10.',
  };

  beforeEach(() => {
    jest.useFakeTimers({ advanceTimers: true });
    localStorage.clear();
    server = new FakeTus();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), { provide: RESUMABLE_HTTP_STACK, useValue: server }] });
    http = TestBed.inject(HttpTestingController);
    signInAs(['experimentalist'], { id: 9, name: 'Dev Okafor', email: 'dev.okafor@kestrelfen.example' });
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  /** Sends `upload` and collects what it reports until it ends. */
  function send(upload: LogUpload = log): { events: UploadProgress[]; ended: Promise<unknown> } {
    const events: UploadProgress[] = [];
    const ended = new Promise<unknown>((resolve) =>
      TestBed.inject(ResumableUploads)
        .send(upload)
        .subscribe({ next: (event) => events.push(event), error: resolve, complete: () => resolve('complete') }),
    );
    return { events, ended };
  }

  const methods = () => server.seen.map((request) => request.method);

  /** Lets `ms` of fake time pass in steps, with a real moment after each for what runs outside the fake clock. */
  async function passTime(ms: number): Promise<void> {
    for (let passed = 0; passed < ms; passed += 500) {
      await jest.advanceTimersByTimeAsync(500);
      await new Promise((resolve) => realSetTimeout(resolve, 1));
    }
  }

  it('creates the upload with the fields as metadata and the session’s token, sends the log and gives the run', async () => {
    const { events, ended } = send();
    expect(await ended).toBe('complete');
    expect(methods()).toEqual(['POST', 'PATCH']);
    const creation = server.seen[0];
    expect(creation.url).toBe('/api/uploads');
    expect(creation.headers['Authorization']).toBe('Bearer token-dev');
    expect(creation.headers['Tus-Resumable']).toBe('1.0.0');
    const metadata = Object.fromEntries(
      creation.headers['Upload-Metadata']
        .split(',')
        .map((pair) => pair.split(' '))
        .map(([key, value]) => [key, atob(value)]),
    );
    expect(metadata).toEqual({ filename: 'night-14.csv', setupId: '2', bookingId: '7', notes: 'Detector B realigned at 23:10.', mapping: '{"columns":{},"outcomes":"0/1"}' });
    expect(events.at(-1)).toEqual({ kind: 'done', run: RUN });
  });

  it('sends a station’s own log with its station, and gives the station log when the night waits for the other station’s', async () => {
    server.waitsForPartner = true;
    const { events, ended } = send({ ...log, station: 'A' });
    expect(await ended).toBe('complete');
    expect(
      atob(
        server.seen[0].headers['Upload-Metadata']
          .split(',')
          .find((pair) => pair.startsWith('station '))!
          .split(' ')[1],
      ),
    ).toBe('A');
    expect(events.at(-1)).toEqual({ kind: 'waiting', stationLog: WAITING_LOG });
  });

  it('goes on from the server’s offset when the link breaks off', async () => {
    server.cutAfter = 10;
    const { events, ended } = send();
    expect(await ended).toBe('complete');
    expect(methods()).toEqual(['POST', 'PATCH', 'HEAD', 'PATCH']);
    expect(server.seen[3].headers['Upload-Offset']).toBe('10');
    expect(server.seen[3].bytes).toBe(LOG.length - 10);
    expect(events.at(-1)).toEqual({ kind: 'done', run: RUN });
  });

  it('asks which run the finished upload made when the last answer was lost, and sends nothing again', async () => {
    server.loseLastAnswer = true;
    const { events, ended } = send();
    while (!methods().includes('HEAD')) await passTime(500);
    await passTime(500);
    http.expectOne('/api/uploads/u1').flush(RUN);
    expect(await ended).toBe('complete');
    expect(methods()).toEqual(['POST', 'PATCH', 'HEAD']);
    expect(events.at(-1)).toEqual({ kind: 'done', run: RUN });
  });

  it('stops at a refusal in the server’s words', async () => {
    server.refuseAtFinish = 'These bytes are already run 40 (attempt 1 of this booking): a log is judged once, under one seed.';
    const { ended } = send();
    expect(apiErrorMessage(await ended)).toBe(server.refuseAtFinish);
    expect(methods()).toEqual(['POST', 'PATCH']);
  });

  it('gives up after the retries while the link is down, and a new attempt resumes where the first stopped', async () => {
    server.cutAfter = 10;
    server.downAfterCut = true;
    const first = send();
    await passTime(60_000);
    expect(apiErrorMessage(await first.ended)).toBe('The Bellkeep server cannot be reached. Check your connection and try again.');
    expect(methods()).toEqual(['POST', 'PATCH', 'HEAD', 'HEAD', 'HEAD', 'HEAD', 'HEAD']);

    server.down = false;
    server.seen.length = 0;
    const second = send();
    expect(await second.ended).toBe('complete');
    expect(methods()).toEqual(['HEAD', 'PATCH']);
    expect(server.seen[1].headers['Upload-Offset']).toBe('10');
  });

  it('starts a new upload when the fields changed since the broken one', async () => {
    server.cutAfter = 10;
    server.downAfterCut = true;
    const first = send();
    await passTime(60_000);
    await first.ended;

    server.down = false;
    server.seen.length = 0;
    const second = send({ ...log, notes: 'Detector B realigned at 23:10; mirror M3 cleaned.' });
    expect(await second.ended).toBe('complete');
    expect(methods()).toEqual(['POST', 'PATCH']);
  });
});
