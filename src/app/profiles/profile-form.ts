import { FormControl, FormGroup, Validators } from '@angular/forms';

import type { AnalysisProfile, CheckFamily, TestSelection } from '@shared/analysis';
import { engineRule, followGeneralBasis, generalAttackControls, generalAttackParameters, numberOf, type GeneralAttackControls } from './general-attack-form';
import { NUMBER_FIELDS, profileNumberText, type NumberField } from '@shared/format/profile-field-labels';

/** The controls of a profile form: the profile's fields, numbers as text. */
export type ProfileControls = Record<NumberField, FormControl<string>> &
  GeneralAttackControls & {
    mode: FormControl<TestSelection['mode']>;
    fraction: FormControl<string>;
    probability: FormControl<string>;
    criterion: FormControl<AnalysisProfile['criterion']>;
    securityModel: FormControl<AnalysisProfile['securityModel']>;
    requirePositiveKey: FormControl<boolean>;
    spaceLikeSeparation: FormControl<AnalysisProfile['spaceLikeSeparation']>;
    blockingChecks: FormControl<CheckFamily[]>;
    note: FormControl<string>;
  };

/** A form for a complete profile, filled from `profile`; each field validated by the engine's rules. */
export function profileForm(profile: AnalysisProfile): FormGroup<ProfileControls> {
  const selection = profile.testSelection;
  const numbers = Object.fromEntries(
    NUMBER_FIELDS.map((field) => [
      field,
      new FormControl(profileNumberText(field, profile[field]), {
        nonNullable: true,
        validators: [engineRule((text: string) => ({ [field]: numberOf(text) }))],
      }),
    ]),
  ) as Record<NumberField, FormControl<string>>;
  const form = new FormGroup<ProfileControls>({
    ...numbers,
    mode: new FormControl(selection.mode, { nonNullable: true }),
    fraction: new FormControl(String(selection.mode === 'fixed-fraction' ? selection.fraction : 0.5), {
      nonNullable: true,
      validators: [engineRule((text: string) => ({ testSelection: { mode: 'fixed-fraction', fraction: numberOf(text) } }))],
    }),
    probability: new FormControl(String(selection.mode === 'bernoulli' ? selection.probability : 0.5), {
      nonNullable: true,
      validators: [engineRule((text: string) => ({ testSelection: { mode: 'bernoulli', probability: numberOf(text) } }))],
    }),
    criterion: new FormControl(profile.criterion, { nonNullable: true }),
    securityModel: new FormControl(profile.securityModel ?? 'collective', { nonNullable: true }),
    ...generalAttackControls(profile),
    requirePositiveKey: new FormControl(profile.requirePositiveKey, { nonNullable: true }),
    blockingChecks: new FormControl([...profile.blockingChecks], { nonNullable: true }),
    spaceLikeSeparation: new FormControl(profile.spaceLikeSeparation ?? 'reported', { nonNullable: true }),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
  });
  // Only the share of the chosen selection mode, and the general settings of the chosen basis, are part of the profile.
  const followMode = (mode: TestSelection['mode']) => {
    followGeneralBasis(form.controls, form.controls.generalBasis.value, mode);
    if (mode === 'fixed-fraction') form.controls.fraction.enable({ emitEvent: false });
    else form.controls.fraction.disable({ emitEvent: false });
    if (mode === 'bernoulli') form.controls.probability.enable({ emitEvent: false });
    else form.controls.probability.disable({ emitEvent: false });
  };
  followMode(selection.mode);
  form.controls.mode.valueChanges.subscribe(followMode);
  form.controls.generalBasis.valueChanges.subscribe((basis) => followGeneralBasis(form.controls, basis, form.controls.mode.value));
  return form;
}

/** The engine parameters a profile form holds (the note is not one of them). */
export function profileParameters(form: FormGroup<ProfileControls>): Record<string, unknown> {
  const value = form.getRawValue();
  const testSelection =
    value.mode === 'fixed-fraction'
      ? { mode: value.mode, fraction: numberOf(value.fraction) }
      : value.mode === 'bernoulli'
        ? { mode: value.mode, probability: numberOf(value.probability) }
        : { mode: value.mode };
  return {
    testSelection,
    criterion: value.criterion,
    ...Object.fromEntries(NUMBER_FIELDS.map((field) => [field, numberOf(value[field])])),
    requirePositiveKey: value.requirePositiveKey,
    blockingChecks: value.blockingChecks,
    spaceLikeSeparation: value.spaceLikeSeparation,
    securityModel: value.securityModel,
    ...generalAttackParameters(value, value.mode),
  };
}
