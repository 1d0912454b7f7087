import path from 'node:path';
import { startTypeScriptWorker } from '@shared/analysis/node';
import type { GeneralAttackPlanDto } from '@shared/api';
import { PlanInputError } from '@shared/planner/plan-rounds';
import type { ThreadReply, ThreadTask } from './general-plan-thread-entry';

/** The thread's file: TypeScript beside this one, or JavaScript when this one is compiled (dist/server/). */
const ENTRY = path.join(__dirname, `general-plan-thread-entry${path.extname(__filename)}`);

/**
 * The general-attack plan in a worker thread of its own: dozens of key-length optimisations take
 * seconds, which must not stop the API's event loop. Rejects with `PlanInputError` for an input
 * the planner refuses; an abort of `signal` (the client went away) stops the thread.
 */
export function planGeneralAttackInThread(task: ThreadTask, signal: AbortSignal): Promise<GeneralAttackPlanDto> {
  const thread = startTypeScriptWorker(ENTRY, { workerData: task });
  const stop = () => void thread.terminate();
  signal.addEventListener('abort', stop, { once: true });
  return new Promise<GeneralAttackPlanDto>((resolve, reject) => {
    thread.once('message', (reply: ThreadReply) => {
      if ('plan' in reply) resolve(reply.plan);
      else if ('refused' in reply) reject(new PlanInputError(reply.refused.message, reply.refused.field));
      else reject(new Error(reply.failed));
    });
    thread.once('error', reject);
    thread.once('exit', () => reject(new Error('The planner thread stopped before it answered.')));
  }).finally(() => {
    signal.removeEventListener('abort', stop);
    void thread.terminate();
  });
}
