import { workerWait } from './worker-wait';

describe('workerWait', () => {
  const now = Date.parse('2026-12-04T03:00:00Z');
  const ago = (seconds: number) => new Date(now - seconds * 1000).toISOString();

  it('says nothing while a worker is on it or a queued run is young', () => {
    expect(workerWait({ state: 'queued', createdAt: ago(5), heartbeatAt: null, analysedBy: null }, now)).toBeNull();
    expect(workerWait({ state: 'analysing', createdAt: ago(600), heartbeatAt: ago(12), analysedBy: 'lab-pc:4711' }, now)).toBeNull();
    expect(workerWait({ state: 'accepted', createdAt: ago(600), heartbeatAt: ago(500), analysedBy: 'lab-pc:4711' }, now)).toBeNull();
  });

  it('says a queued run nobody took waits for a worker, and asks whether one runs', () => {
    expect(workerWait({ state: 'queued', createdAt: ago(45), heartbeatAt: null, analysedBy: null }, now)).toMatch(
      /^No analysis worker has taken this run since .*Is a worker running\?/,
    );
  });

  it('names the silent worker of an analysing run after three missed heartbeats', () => {
    const words = workerWait({ state: 'analysing', createdAt: ago(600), heartbeatAt: ago(31), analysedBy: 'lab-pc:4711' }, now);
    expect(words).toMatch(/^Waiting for a worker: lab-pc:4711 has not been heard from since/);
    expect(words).toContain('nothing is lost');
  });
});
