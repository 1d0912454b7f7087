/**
 * @jest-environment node
 */
import { spawn } from 'node:child_process';
import { chmod, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

import { RESUMABLE_UPLOAD_PATH } from '@shared/api';
import { acquisitionRecipe, UPLOAD_TOKEN_PLACEHOLDER } from './acquisition-recipe';

const LOG = 'round,x,y,a,b\n1,0,1,0,0\n2,1,1,1,0\n3,0,0,1,1\n4,1,0,0,0\n';
const RUN = { id: 41, state: 'queued' };

/** How the fake tus server misbehaves, once each. */
interface Mishaps {
  /** The first PATCH breaks off after this many bytes. */
  breakAfter?: number;
  /** The PATCH that completes the upload makes the run, then the connection drops before the answer. */
  loseLastAnswer?: boolean;
  /** Creation is refused with the API's error body. */
  refuseCreation?: boolean;
  /** The complete log is refused (bytes seen before): the upload is dropped. */
  refuseAtFinish?: boolean;
}

/** Just enough of the server's tus endpoint (one upload) to run the recipe against, with its requests written down. */
class FakeTusServer {
  readonly requests: { method: string; headers: IncomingMessage['headers'] }[] = [];
  received = Buffer.alloc(0);
  private length = 0;
  private finished = false;
  private gone = false;
  private readonly server: Server;

  constructor(private readonly mishaps: Mishaps) {
    this.server = createServer((request, response) => this.answer(request, response));
  }

  async start(): Promise<string> {
    await new Promise<void>((resolve) => this.server.listen(0, '127.0.0.1', resolve));
    return `http://127.0.0.1:${(this.server.address() as AddressInfo).port}`;
  }

  stop(): Promise<void> {
    return new Promise((resolve) => this.server.close(() => resolve()));
  }

  private answer(request: IncomingMessage, response: ServerResponse): void {
    this.requests.push({ method: request.method!, headers: request.headers });
    const url = request.url!;
    if (request.method === 'POST' && url === RESUMABLE_UPLOAD_PATH) {
      if (this.mishaps.refuseCreation) {
        response.writeHead(400, { 'Content-Type': 'application/json' }).end(JSON.stringify({ error: { code: 'validation', message: 'setupId: there is no setup 3' } }));
        return;
      }
      this.length = Number(request.headers['upload-length']);
      // The server answers with a full address, as @tus/server does.
      response.writeHead(201, { Location: `http://${request.headers.host}${RESUMABLE_UPLOAD_PATH}/abc123`, 'Tus-Resumable': '1.0.0' }).end();
    } else if (request.method === 'HEAD' && url.endsWith('/abc123')) {
      if (this.gone) response.writeHead(404).end();
      else response.writeHead(200, { 'Upload-Offset': String(this.received.length), 'Upload-Length': String(this.length), 'Tus-Resumable': '1.0.0' }).end();
    } else if (request.method === 'GET' && url.endsWith('/abc123')) {
      if (this.finished) response.writeHead(200, { 'Content-Type': 'application/json' }).end(JSON.stringify(RUN));
      else
        response
          .writeHead(404, { 'Content-Type': 'application/json' })
          .end(JSON.stringify({ error: { code: 'not-found', message: 'There is no finished upload abc123 of yours.' } }));
    } else if (request.method === 'PATCH' && url.endsWith('/abc123')) {
      this.receivePatch(request, response);
    } else {
      response.writeHead(405).end();
    }
  }

  private receivePatch(request: IncomingMessage, response: ServerResponse): void {
    if (Number(request.headers['upload-offset']) !== this.received.length) {
      response.writeHead(409).end('Upload-Offset header does not match current offset of file\n');
      return;
    }
    request.on('data', (chunk: Buffer) => {
      const breakAfter = this.mishaps.breakAfter;
      if (breakAfter !== undefined && this.received.length + chunk.length > breakAfter) {
        this.received = Buffer.concat([this.received, chunk.subarray(0, breakAfter - this.received.length)]);
        delete this.mishaps.breakAfter;
        request.socket.destroy();
        return;
      }
      this.received = Buffer.concat([this.received, chunk]);
    });
    request.on('end', () => {
      if (this.received.length < this.length) {
        response.writeHead(204, { 'Upload-Offset': String(this.received.length), 'Tus-Resumable': '1.0.0' }).end();
        return;
      }
      this.gone = true;
      if (this.mishaps.refuseAtFinish) {
        response.writeHead(409, { 'Content-Type': 'application/json' }).end(JSON.stringify({ error: { code: 'conflict', message: 'These bytes are already run 40.' } }));
        return;
      }
      this.finished = true;
      if (this.mishaps.loseLastAnswer) {
        request.socket.destroy();
        return;
      }
      response.writeHead(201, { 'Upload-Offset': String(this.length), 'Content-Type': 'application/json', 'Tus-Resumable': '1.0.0' }).end(JSON.stringify(RUN));
    });
  }
}

describe('acquisitionRecipe', () => {
  const origin = 'https://bellkeep.kestrelfen.example';

  it('names the server, the setup, the token placeholder and the tus headers', () => {
    const recipe = acquisitionRecipe(origin, 3);
    expect(recipe).toContain(`'${origin}${RESUMABLE_UPLOAD_PATH}'`);
    expect(recipe).toContain(`Authorization: Bearer ${UPLOAD_TOKEN_PLACEHOLDER}`);
    expect(recipe).toContain('setup 3');
    expect(recipe).toContain('setupId $(printf 3 | base64)');
    for (const header of ['Tus-Resumable: 1.0.0', 'Upload-Length: ', 'Upload-Metadata: ', 'Upload-Offset: ', 'Content-Type: application/offset+octet-stream']) {
      expect(recipe).toContain(header);
    }
    expect(recipe).toMatch(/curl -sfI "\$URL"/);
    expect(recipe).toContain('-X PATCH');
  });

  it('stays short enough to read', () => {
    expect(acquisitionRecipe(origin, 3).trim().split('\n').length).toBeLessThanOrEqual(22);
  });

  describe('run by bash against a tus endpoint', () => {
    let folder: string;
    let logFile: string;
    let server: FakeTusServer;

    beforeEach(async () => {
      folder = await mkdtemp(path.join(tmpdir(), 'bellkeep-recipe-'));
      logFile = path.join(folder, 'night 14.csv');
      await writeFile(logFile, LOG);
      // The recipe waits 10 s before trying again; the test need not.
      await writeFile(path.join(folder, 'sleep'), '#!/bin/sh\nexit 0\n');
      await chmod(path.join(folder, 'sleep'), 0o755);
    });

    afterEach(async () => {
      await server.stop();
      await rm(folder, { recursive: true, force: true });
    });

    /** Runs the recipe as the acquisition computer would, with the token pasted in. */
    async function runRecipe(mishaps: Mishaps): Promise<{ code: number | null; stdout: string; stderr: string }> {
      server = new FakeTusServer(mishaps);
      const script = acquisitionRecipe(await server.start(), 3).replace(UPLOAD_TOKEN_PLACEHOLDER, 'bkup_fen-acquisition');
      const child = spawn('bash', ['-c', script, 'send-log.sh', logFile], { env: { ...process.env, PATH: `${folder}:${process.env['PATH']}` } });
      let stdout = '';
      let stderr = '';
      child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
      child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
      const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
      return { code, stdout, stderr };
    }

    it('creates the upload with the file name and setup as metadata, sends the log and prints the run', async () => {
      const { code, stdout } = await runRecipe({});
      expect(code).toBe(0);
      expect(JSON.parse(stdout)).toEqual(RUN);
      expect(server.received.toString()).toBe(LOG);
      const creation = server.requests[0];
      expect(creation.method).toBe('POST');
      expect(creation.headers['authorization']).toBe('Bearer bkup_fen-acquisition');
      expect(creation.headers['tus-resumable']).toBe('1.0.0');
      expect(creation.headers['upload-length']).toBe(String(Buffer.byteLength(LOG)));
      const metadata = Object.fromEntries(
        String(creation.headers['upload-metadata'])
          .split(',')
          .map((pair) => pair.split(' '))
          .map(([key, value]) => [key, Buffer.from(value, 'base64').toString()]),
      );
      expect(metadata).toEqual({ filename: 'night 14.csv', setupId: '3' });
    });

    it('goes on from the offset the server has when the link breaks off', async () => {
      const { code, stdout } = await runRecipe({ breakAfter: 7 });
      expect(code).toBe(0);
      expect(JSON.parse(stdout)).toEqual(RUN);
      expect(server.received.toString()).toBe(LOG);
      expect(server.requests.map((request) => request.method)).toEqual(['POST', 'HEAD', 'PATCH', 'HEAD', 'PATCH']);
      expect(server.requests[4].headers['upload-offset']).toBe('7');
    });

    it('asks which run a finished upload made when the last answer was lost, and sends nothing twice', async () => {
      const { code, stdout } = await runRecipe({ loseLastAnswer: true });
      expect(code).toBe(0);
      expect(JSON.parse(stdout)).toEqual(RUN);
      expect(server.requests.map((request) => request.method)).toEqual(['POST', 'HEAD', 'PATCH', 'HEAD', 'GET']);
    });

    it('prints the refusal and stops when the complete log is refused', async () => {
      const { code, stdout } = await runRecipe({ refuseAtFinish: true });
      expect(code).toBe(1);
      expect(stdout).toContain('These bytes are already run 40.');
      expect(server.requests.map((request) => request.method)).toEqual(['POST', 'HEAD', 'PATCH', 'HEAD', 'GET']);
    });

    it('prints the refusal and stops when the upload is not taken', async () => {
      const { code, stderr } = await runRecipe({ refuseCreation: true });
      expect(code).toBe(1);
      expect(stderr).toContain('there is no setup 3');
      expect(server.requests.map((request) => request.method)).toEqual(['POST']);
    });
  });
});
