import type { GeneralAttackPlanDto } from '@shared/api';
import {
  bestGeneralTestProbability,
  generalKeyCurve,
  generalKeyPoint,
  generalPlanCautions,
  generalPlanProblem,
  roundsForPositiveGeneralKey,
} from '@shared/planner/plan-general-attack';
import { PlanInputError, type PlanInput } from '@shared/planner/plan-rounds';

/**
 * The general-attack plan is split in two tasks run side by side (each key length is a full
 * optimisation, about 0.2 s): `rounds` gives the key at N, then the curve over N, then the
 * smallest N; `gamma` the best test probability at N.
 */
export type GeneralPlanPart = 'rounds' | 'gamma';

/** What a planner task is asked: the planner input and the N the collective plan chose. */
export interface GeneralPlanTask {
  part: GeneralPlanPart;
  input: PlanInput;
  recommended: { roundsForPositiveKey: number | null; roundsForLikelyPass: number | null };
}

/** One step's answer: a piece of the plan, or why there is none. */
export type GeneralPlanStep = Partial<GeneralAttackPlanDto> | { unavailable: string };

/** The steps of one task, in the order they are worth showing. */
export function* generalPlanSteps(task: GeneralPlanTask): Generator<GeneralPlanStep> {
  let problem;
  try {
    problem = generalPlanProblem(task.input, task.recommended);
  } catch (error) {
    if (error instanceof PlanInputError) {
      yield { unavailable: error.message };
      return;
    }
    throw error;
  }
  if (task.part === 'gamma') {
    yield { bestTestProbability: bestGeneralTestProbability(problem) };
    return;
  }
  yield { settings: problem.settings, at: generalKeyPoint(problem, problem.rounds), cautions: generalPlanCautions(problem.settings) };
  const curve = generalKeyCurve(problem);
  yield { curve };
  yield { roundsForPositiveKey: roundsForPositiveGeneralKey(problem, curve) };
}
