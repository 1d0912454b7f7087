import { FINISHED_STATES, type LoginRequest, type LoginResponse, type RunDto, type SetupDto } from '@shared/api';

const POLL_INTERVAL_MS = 200;

/** The few API calls the bench makes besides the upload, as one signed-in person. */
export interface BenchClient {
  token: string;
  setupId(name: string): Promise<number>;
  /** Polls the run until its analysis is over: the finished run and when each stage was first seen. */
  waitForVerdict(id: number, timeoutMs: number): Promise<VerdictWatch>;
}

/** Times (performance.now()) at which a poll first saw each stage; null when it passed between two polls. */
export interface VerdictWatch {
  run: RunDto;
  /** Progress above 0: the engine reads the file (with S3, after the working copy is down). */
  readingAt: number | null;
  finishedAt: number;
}

/** Signs in through `POST /api/auth/login`. */
export async function signIn(apiUrl: string, credentials: LoginRequest): Promise<BenchClient> {
  const { token } = await call<LoginResponse>(`${apiUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(credentials),
  });
  const signedIn = { headers: { Authorization: `Bearer ${token}` } };
  const run = (id: number) => call<RunDto>(`${apiUrl}/api/runs/${id}`, signedIn);
  return {
    token,
    async setupId(name) {
      const found = (await call<SetupDto[]>(`${apiUrl}/api/setups`, signedIn)).find((setup) => setup.name === name);
      if (!found) throw new Error(`The API lists no setup named "${name}".`);
      return found.id;
    },
    async waitForVerdict(id, timeoutMs) {
      const deadline = performance.now() + timeoutMs;
      let readingAt: number | null = null;
      for (;;) {
        const found = await run(id);
        const seenAt = performance.now();
        if (FINISHED_STATES.includes(found.state)) return { run: found, readingAt, finishedAt: seenAt };
        if (found.progress > 0) readingAt ??= seenAt;
        if (seenAt > deadline) throw new Error(`Run ${id} is still ${found.state} (progress ${found.progress}) after ${timeoutMs / 1000} s.`);
        await new Promise((resolve) => setTimeout(resolve, POLL_INTERVAL_MS));
      }
    },
  };
}

async function call<T>(url: string, init: RequestInit): Promise<T> {
  const response = await fetch(url, init);
  if (!response.ok) throw new Error(`${init.method ?? 'GET'} ${url} answered ${response.status}: ${await response.text()}`);
  return (await response.json()) as T;
}
