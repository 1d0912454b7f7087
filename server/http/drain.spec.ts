import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { drain, type Lifecycle } from './drain';

/** A server whose requests answer after the number of milliseconds in their path. */
async function slowServer(): Promise<{ server: http.Server; get: (ms: number) => Promise<string> }> {
  const server = http.createServer((request, response) => {
    setTimeout(() => response.end('done'), Number(request.url!.slice(1)));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const get = (ms: number) =>
    new Promise<string>((resolve) => {
      http
        .get(`http://127.0.0.1:${port}/${ms}`, (response) => {
          let body = '';
          response.on('data', (chunk: Buffer) => (body += chunk.toString()));
          response.on('end', () => resolve(body));
        })
        .on('error', (error) => resolve(`failed: ${error.message}`));
    });
  return { server, get };
}

describe('draining a stopping API', () => {
  it('lets a request in flight finish, refuses new connections, and says it is stopping', async () => {
    const { server, get } = await slowServer();
    const inFlight = get(200);
    await new Promise((resolve) => setTimeout(resolve, 50));
    const lifecycle: Lifecycle = { draining: false };
    const drained = drain(server, lifecycle, 5);
    expect(lifecycle.draining).toBe(true);
    expect(await get(0)).toMatch(/^failed: .*ECONNREFUSED/);
    expect(await inFlight).toBe('done');
    const started = performance.now();
    await drained;
    expect(server.listening).toBe(false);
    // Its keep-alive connection, idle now, does not hold the stop for the keep-alive time (5 s).
    expect(performance.now() - started).toBeLessThan(1_000);
  });

  it('cuts a request still running when the drain time is up, and no later', async () => {
    const { server, get } = await slowServer();
    const inFlight = get(10_000);
    await new Promise((resolve) => setTimeout(resolve, 50));
    const started = performance.now();
    await drain(server, { draining: false }, 0.3);
    const waited = performance.now() - started;
    expect(waited).toBeGreaterThanOrEqual(290);
    expect(waited).toBeLessThan(5_000);
    expect(await inFlight).toMatch(/^failed: /);
  });
});
