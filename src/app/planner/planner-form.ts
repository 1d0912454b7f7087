import { FormControl, FormGroup, Validators } from '@angular/forms';

import { chshValueFromWinFraction, QUANTUM_CHSH_VALUE, QUANTUM_WIN_FRACTION, winFractionFromChshValue } from '@shared/analysis';
import type { PlanPrefillDto } from '@shared/api';
import type { PlanInput } from '@shared/planner/plan-rounds';
import { formatCount } from '@shared/format/numbers';
import { parseRoundCount, roundCountValidator } from './round-count';

/** How the expected device strength is typed: as the CHSH win fraction ω or as the CHSH value S. */
export type DeviceMeasure = 'winFraction' | 'chshValue';

/** The planner's inputs. Percentages are typed as people say them (2 for 2 %), the rounds as text. */
export function createPlannerForm() {
  return new FormGroup({
    setupId: new FormControl<number | null>(null),
    measure: new FormControl<DeviceMeasure>('winFraction', { nonNullable: true }),
    winFraction: new FormControl<number | null>(null, [Validators.required, Validators.min(0), Validators.max(QUANTUM_WIN_FRACTION)]),
    chshValue: new FormControl<number | null>({ value: null, disabled: true }, [Validators.required, Validators.min(-4), Validators.max(QUANTUM_CHSH_VALUE)]),
    qberPercent: new FormControl<number | null>(null, [Validators.required, Validators.min(0), Validators.max(50)]),
    profileVersionId: new FormControl<number | null>(null, Validators.required),
    // Left empty, the planner plans at the smallest budget that gives both a key and a likely pass.
    rounds: new FormControl('', { nonNullable: true, validators: roundCountValidator }),
    // Only a profile that takes its test rounds from the log leaves the share open; enabled then.
    testFractionPercent: new FormControl<number | null>({ value: null, disabled: true }, [Validators.required, Validators.min(0), Validators.max(100)]),
    trialRate: new FormControl<number | null>(null, Validators.min(0)),
    // Not typed: a setup's pooled runs bring it; without one the planner takes fair settings.
    xZeroProbability: new FormControl<number | null>(null),
  });
}

/** The planner's form. */
export type PlannerForm = ReturnType<typeof createPlannerForm>;

/** Everything the form holds, disabled controls included. */
export type PlannerFormValue = ReturnType<PlannerForm['getRawValue']>;

/** The typed controls, named as {@link FIELD_LABELS} names them. */
export type PlannerField = Exclude<keyof PlannerForm['controls'], 'measure' | 'xZeroProbability'>;

/** The words on each input, also used to name a field that needs attention. */
export const FIELD_LABELS: Readonly<Record<PlannerField, string>> = {
  setupId: 'Setup',
  winFraction: 'Expected win fraction',
  chshValue: 'Expected S',
  qberPercent: 'Expected QBER (%)',
  profileVersionId: 'Profile version',
  rounds: 'Rounds (N)',
  testFractionPercent: 'Test fraction (%)',
  trialRate: 'Rounds per second',
};

/** The label of the input behind each field `planRounds` may refuse. */
export const PLAN_FIELD_LABELS: Readonly<Record<string, string>> = {
  winFraction: FIELD_LABELS.winFraction,
  qber: FIELD_LABELS.qberPercent,
  rounds: FIELD_LABELS.rounds,
  testFraction: FIELD_LABELS.testFractionPercent,
  trialRate: FIELD_LABELS.trialRate,
  profile: FIELD_LABELS.profileVersionId,
  xZeroProbability: 'The setup’s share of x = 0 rounds',
};

/** Labels of the enabled inputs that are empty or refused, in the form's order. */
export function fieldsNeedingAttention(form: PlannerForm): string[] {
  return (Object.keys(FIELD_LABELS) as PlannerField[]).filter((field) => form.controls[field].invalid).map((field) => FIELD_LABELS[field]);
}

/** Digits kept when ω and S are converted into each other: enough for any plan, none of the float's noise. */
const CONVERTED_DECIMALS = 6;

/** Switches the device input to `measure`, carrying the value across so the device stays the same. */
export function showDeviceAs(form: PlannerForm, measure: DeviceMeasure): void {
  const { winFraction, chshValue } = form.controls;
  const [shown, hidden] = measure === 'winFraction' ? [winFraction, chshValue] : [chshValue, winFraction];
  form.controls.measure.setValue(measure);
  if (shown.enabled) return;
  const value = hidden.value;
  const converted = value === null ? null : measure === 'winFraction' ? winFractionFromChshValue(value) : chshValueFromWinFraction(value);
  shown.setValue(converted === null ? null : roundTo(converted, CONVERTED_DECIMALS));
  shown.enable();
  hidden.disable();
}

/** ω as the form gives it, whichever measure is typed; null while it is empty. */
function expectedWinFraction(value: PlannerFormValue): number | null {
  if (value.measure === 'winFraction') return value.winFraction;
  return value.chshValue === null ? null : winFractionFromChshValue(value.chshValue);
}

/** What `planRounds` is asked for the form and the chosen profile version's parameters; null while a needed input is empty. */
export function planInputFrom(value: PlannerFormValue, profile: unknown, needsTestFraction: boolean): PlanInput | null {
  const winFraction = expectedWinFraction(value);
  const roundsGiven = value.rounds.trim() !== '';
  const rounds = roundsGiven ? parseRoundCount(value.rounds) : undefined;
  const { qberPercent, testFractionPercent } = value;
  if (winFraction === null || qberPercent === null || rounds === null || (needsTestFraction && testFractionPercent === null)) return null;
  return {
    device: { winFraction, qber: qberPercent / 100, xZeroProbability: value.xZeroProbability ?? undefined, trialRate: value.trialRate },
    profile,
    rounds,
    testFraction: needsTestFraction && testFractionPercent !== null ? testFractionPercent / 100 : undefined,
  };
}

/** Decimals a setup's pooled figures are typed with: ω to 1e-4, the QBER to a hundredth of a percent. */
const PREFILLED_DECIMALS = { winFraction: 4, qberPercent: 2 };

/**
 * Fills the form in from a setup's pooled runs: its profile version and x = 0 share always, and
 * whatever figures the runs gave (none without accepted runs). The device is then typed as ω.
 */
export function applyPrefill(form: PlannerForm, prefill: PlanPrefillDto): void {
  const { controls } = form;
  controls.profileVersionId.setValue(prefill.profileVersionId);
  controls.xZeroProbability.setValue(prefill.xZeroProbability);
  if (prefill.winFraction !== null) {
    showDeviceAs(form, 'winFraction');
    controls.winFraction.setValue(roundTo(prefill.winFraction, PREFILLED_DECIMALS.winFraction));
  }
  if (prefill.qber !== null) controls.qberPercent.setValue(roundTo(prefill.qber * 100, PREFILLED_DECIMALS.qberPercent));
  if (prefill.rounds !== null) controls.rounds.setValue(formatCount(prefill.rounds));
}

function roundTo(value: number, decimals: number): number {
  const scale = 10 ** decimals;
  return Math.round(value * scale) / scale;
}
