import { parentPort, workerData } from 'node:worker_threads';
import type { GeneralAttackPlanDto } from '@shared/api';
import { generalPlanProblem, planGeneralAttack } from '@shared/planner/plan-general-attack';
import { PlanInputError, type PlanInput } from '@shared/planner/plan-rounds';

/** What the thread is given: the planner input and the N the collective plan chose. */
export interface ThreadTask {
  input: PlanInput;
  recommended: { roundsForPositiveKey: number | null; roundsForLikelyPass: number | null };
}

/** What it answers, once. */
export type ThreadReply = { plan: GeneralAttackPlanDto } | { refused: { message: string; field: string } } | { failed: string };

// The thread of `planGeneralAttackInThread`: plans, answers, and ends.
function answer(task: ThreadTask): ThreadReply {
  try {
    return { plan: planGeneralAttack(generalPlanProblem(task.input, task.recommended)) };
  } catch (error) {
    if (error instanceof PlanInputError) return { refused: { message: error.message, field: error.field } };
    return { failed: error instanceof Error ? error.message : String(error) };
  }
}

parentPort!.postMessage(answer(workerData as ThreadTask));
