import type { PlanDto } from '@shared/api';
import type { AnalysisProfile } from '@shared/analysis';
import { planRounds, PlanInputError, type PlanInput } from '@shared/planner/plan-rounds';
import { PLAN_FIELD_LABELS, planInputFrom, type PlannerFormValue } from './planner-form';
import { takesTestRoundsFromLog, type ProfileVersionOption } from './profile-versions';

/** Where the plan is: waiting for inputs, refused by the planner with its sentence, or computed. */
export type PlanOutcome =
  | { status: 'waiting'; missing: string[] }
  | { status: 'refused'; field: string; message: string }
  | { status: 'ready'; plan: PlanDto; profile: AnalysisProfile; input: PlanInput; roundsChosenByPlanner: boolean };

/**
 * The plan for the settled form: `planRounds` from the shared engine, run here in the browser.
 * `missing` lists the inputs still empty or refused by the form's own checks.
 */
export function planOutcome(value: PlannerFormValue, missing: string[], version: ProfileVersionOption | undefined): PlanOutcome {
  const input = version === undefined ? null : planInputFrom(value, version.parameters, takesTestRoundsFromLog(version));
  if (missing.length > 0 || version === undefined || input === null) return { status: 'waiting', missing };
  try {
    const plan = planRounds(input);
    // planRounds refuses parameters that do not parse, so a computed plan has its parsed profile.
    return { status: 'ready', plan, profile: version.profile!, input, roundsChosenByPlanner: input.rounds === undefined };
  } catch (error) {
    if (!(error instanceof PlanInputError)) throw error;
    return { status: 'refused', field: PLAN_FIELD_LABELS[error.field] ?? error.field, message: error.message };
  }
}
