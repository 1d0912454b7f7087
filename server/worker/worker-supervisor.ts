import type { ChildProcess } from 'node:child_process';
import { spawnWorkerProcess, stopWorkerProcess } from './worker-process';

/** Waits before starting a worker again: doubling from the first while it keeps dying young. */
const FIRST_DELAY_MS = 1_000;
const LONGEST_DELAY_MS = 60_000;
/** A worker that lived this long was healthy: the next restart waits the first delay again. */
const HEALTHY_AFTER_MS = 60_000;

export interface WorkerSupervisor {
  /** Restarts within the last hour: more than a few say the worker keeps dying. */
  recentRestarts(): number;
  /** Stops the worker (it hands back the job in hand) and starts no other. */
  stop(): Promise<void>;
}

/**
 * Runs one analysis worker process and starts it again whenever it ends without being asked to
 * (killed, crashed, out of memory), after a back-off that doubles while it keeps dying within a
 * minute of starting (1 s, 2 s, 4 s ... 60 s). Each event is one line through `say`, and each
 * end goes to `onUnaskedEnd` (which records it for the admins). A job the
 * dead worker held is handed out again by the queue once its expiry passes.
 */
export function superviseWorker(
  environment: Record<string, string>,
  say: (line: string) => void,
  onUnaskedEnd: (pid: number, how: string) => void = () => undefined,
): WorkerSupervisor {
  let child: ChildProcess;
  let startedAt = 0;
  let delay = FIRST_DELAY_MS;
  let stopping = false;
  let pending: NodeJS.Timeout | undefined;
  const restarts: number[] = [];

  const start = () => {
    startedAt = Date.now();
    child = spawnWorkerProcess({ ...environment, BELLKEEP_WORKER_STARTER_PID: String(process.pid) });
    const pid = child.pid;
    child.once('exit', (code, signal) => {
      if (stopping) return;
      const how = signal ? `killed (${signal})` : `exit code ${code}`;
      onUnaskedEnd(pid!, how);
      if (Date.now() - startedAt >= HEALTHY_AFTER_MS) delay = FIRST_DELAY_MS;
      const wait = delay;
      delay = Math.min(delay * 2, LONGEST_DELAY_MS);
      restarts.push(Date.now());
      const recent = recentRestarts();
      say(`Worker ${pid} ended, ${how}; starting another in ${wait / 1000} s` + (recent > 3 ? ` (${recent} restarts in the last hour: it keeps dying, see its output above)` : ''));
      pending = setTimeout(start, wait);
    });
  };

  function recentRestarts(): number {
    const hourAgo = Date.now() - 3_600_000;
    while (restarts.length > 0 && restarts[0] < hourAgo) restarts.shift();
    return restarts.length;
  }

  start();
  return {
    recentRestarts,
    async stop() {
      stopping = true;
      clearTimeout(pending);
      await stopWorkerProcess(child);
    },
  };
}
