import { DEMO_SETUPS } from '@seeders/data/demo-lab';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@seeders/data/demo-people';
import type { RunState, Verdict } from '@shared/api';
import { freePort } from '@tests/support/free-port';
import { signIn } from './api-client';
import { startBellkeepProcess, type BellkeepProcess } from './bellkeep-process';
import type { StorageMode } from './options';
import { uploadStreamedLog } from './streamed-upload';
import { startThrowawayLab } from './throwaway-lab';

const VERDICT_TIMEOUT_MS = 20 * 60_000;

/** One upload through the API to its verdict, with one storage mode. */
export interface PipelineMeasurement {
  storage: StorageMode;
  logBytes: number;
  /** First byte sent to the 201. */
  uploadSeconds: number;
  /** The 201 to the first poll that saw the verdict. */
  verdictSeconds: number;
  totalSeconds: number;
  /** From the run's own timestamps: created to taken by the worker, and taken to stored. */
  queueSeconds: number;
  analysisSeconds: number;
  /**
   * The same span in stages as the polls saw them (each to within a 200 ms poll and a 3 % progress
   * step): the 201 to the first byte read (queue, and with S3 the working copy), then the engine's
   * reading to the stored verdict (one pass with the upload's census, else a counting pass and an
   * analysis pass). Null when a stage passed between two polls.
   */
  stages: { toReadingSeconds: number | null; readingSeconds: number | null };
  apiPeakMB: number;
  workerPeakMB: number;
  /** The same high-water marks when both had started, before the upload: what the runtime and modules take. */
  apiStartedMB: number;
  workerStartedMB: number;
  state: RunState;
  verdict: Verdict | null;
}

/**
 * A throwaway lab, the API and one worker as processes of their own, then the demo experimentalist
 * uploads the log of `chunks` and polls until the verdict; peak memory is read before both stop.
 */
export async function measurePipeline(
  storage: StorageMode,
  chunks: Iterable<Buffer>,
  options: { profileFolder?: string; say: (line: string) => void },
): Promise<PipelineMeasurement> {
  const { profileFolder, say } = options;
  say(`[${storage}] starting PostgreSQL, the mail catcher and the demo lab`);
  const lab = await startThrowawayLab(storage);
  const started: BellkeepProcess[] = [];
  try {
    const port = await freePort();
    const apiUrl = `http://127.0.0.1:${port}`;
    const api = await startBellkeepProcess(
      'server/api-main.ts',
      { ...lab.apiEnvironment, BELLKEEP_HOST: '127.0.0.1', BELLKEEP_PORT: String(port), BELLKEEP_PUBLIC_URL: apiUrl },
      /^Bellkeep API \d+ on /m,
      profileFolder,
    );
    started.push(api);
    const worker = await startBellkeepProcess('server/worker/main.ts', { ...lab.workerEnvironment, BELLKEEP_PUBLIC_URL: apiUrl }, /is taking analysis jobs/, profileFolder);
    started.push(worker);
    const apiStartedMB = api.peakMemoryMB();
    const workerStartedMB = worker.peakMemoryMB();
    say(`[${storage}] API ${api.pid} on ${apiUrl}, worker ${worker.pid}; uploading`);

    const experimentalist = DEMO_PEOPLE.find((person) => person.roles.join() === 'experimentalist')!;
    const client = await signIn(apiUrl, { email: experimentalist.email, password: DEMO_PASSWORD });
    const setupId = await client.setupId(DEMO_SETUPS[0].name);
    const upload = await uploadStreamedLog(apiUrl, client.token, { setupId: String(setupId) }, chunks);
    say(`[${storage}] run ${upload.run.id} created after ${seconds(upload.startedAt, upload.answeredAt).toFixed(1)} s; waiting for its verdict`);
    const { run, readingAt, finishedAt } = await client.waitForVerdict(upload.run.id, VERDICT_TIMEOUT_MS);

    return {
      storage,
      logBytes: upload.logBytes,
      uploadSeconds: seconds(upload.startedAt, upload.answeredAt),
      verdictSeconds: seconds(upload.answeredAt, finishedAt),
      totalSeconds: seconds(upload.startedAt, finishedAt),
      queueSeconds: seconds(Date.parse(run.createdAt), Date.parse(run.startedAt!)),
      analysisSeconds: seconds(Date.parse(run.startedAt!), Date.parse(run.finishedAt!)),
      stages: {
        toReadingSeconds: readingAt === null ? null : seconds(upload.answeredAt, readingAt),
        readingSeconds: readingAt === null ? null : seconds(readingAt, finishedAt),
      },
      apiPeakMB: api.peakMemoryMB(),
      workerPeakMB: worker.peakMemoryMB(),
      apiStartedMB,
      workerStartedMB,
      state: run.state,
      verdict: run.verdict,
    };
  } finally {
    for (const child of started.reverse()) await child.stop();
    await lab.stop();
  }
}

function seconds(fromMs: number, toMs: number): number {
  return (toMs - fromMs) / 1000;
}
