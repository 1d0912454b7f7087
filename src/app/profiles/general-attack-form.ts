import { FormControl, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';

import { type AnalysisProfile, parseProfile } from '@shared/analysis';
import { formatScientific } from '@shared/format/numbers';

/** How the general-attack key is set up: not at all, from design values, or from fixed ones. */
export type GeneralBasis = 'none' | 'design' | 'fixed';

/** The profile form's controls for the key length against general attacks, numbers as text. */
export interface GeneralAttackControls {
  generalBasis: FormControl<GeneralBasis>;
  generalSoundness: FormControl<string>;
  designChshValue: FormControl<string>;
  designQber: FormControl<string>;
  omegaThreshold: FormControl<string>;
  syndromeBits: FormControl<string>;
  generalTestProbability: FormControl<string>;
}

/** The typed general-attack fields, in the order the form shows them. */
export const GENERAL_FIELDS = ['generalSoundness', 'designChshValue', 'designQber', 'omegaThreshold', 'syndromeBits', 'generalTestProbability'] as const;

/** Valid stand-ins for the other general settings while one field is checked alone. */
const OTHER_DESIGN = { chshValue: 2.7, qber: 0.02 };

/** A number typed as text: the number it reads as, or NaN (which the engine calls "not a number"). */
export function numberOf(text: string): number {
  return text.trim() === '' ? NaN : Number(text.trim());
}

/**
 * A validator by the engine's own profile rules for one field: the fragment `partial` builds from
 * the control's text goes through `parseProfile`, every other field at its default; the engine's
 * message (without its "profile field …:" prefix) is the error.
 */
export function engineRule(partial: (value: string) => Record<string, unknown>): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const parsed = parseProfile(partial(control.value as string));
    return parsed.ok ? null : { profile: sentence(parsed.message.replace(/^profile field [^:]+: /, '')) };
  };
}

function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1) + (message.endsWith('.') || message.endsWith(')') ? '' : '.');
}

const textControl = (value: string, fragment: (value: number) => Record<string, unknown>) =>
  new FormControl(value, { nonNullable: true, validators: [engineRule((text) => ({ generalAttack: fragment(numberOf(text)) }))] });

/** The controls, filled from the profile's general-attack settings (or sensible starting values). */
export function generalAttackControls(profile: AnalysisProfile): GeneralAttackControls {
  const settings = profile.generalAttack;
  const basis: GeneralBasis = settings === undefined ? 'none' : settings.design ? 'design' : 'fixed';
  return {
    generalBasis: new FormControl(basis, { nonNullable: true }),
    generalSoundness: textControl(formatScientific(settings?.soundness ?? 1e-10), (soundness) => ({ soundness, design: OTHER_DESIGN })),
    designChshValue: textControl(String(settings?.design?.chshValue ?? 2.64), (chshValue) => ({ design: { ...OTHER_DESIGN, chshValue } })),
    designQber: textControl(String(settings?.design?.qber ?? 0.018), (qber) => ({ design: { ...OTHER_DESIGN, qber } })),
    omegaThreshold: textControl(String(settings?.omegaThreshold ?? 0.8255), (omegaThreshold) => ({ omegaThreshold, syndromeBits: 0 })),
    syndromeBits: textControl(String(settings?.syndromeBits ?? 0), (syndromeBits) => ({ omegaThreshold: 0.8, syndromeBits })),
    generalTestProbability: textControl(String(settings?.testProbability ?? 0.05), (testProbability) => ({ testProbability, design: OTHER_DESIGN })),
  };
}

/** Enables the general-attack fields the chosen basis and selection mode use, and only those. */
export function followGeneralBasis(controls: GeneralAttackControls, basis: GeneralBasis, selectionMode: string): void {
  const use = (control: AbstractControl, used: boolean) => (used ? control.enable({ emitEvent: false }) : control.disable({ emitEvent: false }));
  use(controls.generalSoundness, basis !== 'none');
  use(controls.designChshValue, basis === 'design');
  use(controls.designQber, basis === 'design');
  use(controls.omegaThreshold, basis === 'fixed');
  use(controls.syndromeBits, basis === 'fixed');
  use(controls.generalTestProbability, basis !== 'none' && selectionMode === 'from-log');
}

/** The profile's `generalAttack` from the form's values, or nothing when it is not computed. */
export function generalAttackParameters(value: { [K in keyof GeneralAttackControls]: GeneralAttackControls[K]['value'] }, selectionMode: string): Record<string, unknown> {
  if (value.generalBasis === 'none') return {};
  const basis =
    value.generalBasis === 'design'
      ? { design: { chshValue: numberOf(value.designChshValue), qber: numberOf(value.designQber) } }
      : { omegaThreshold: numberOf(value.omegaThreshold), syndromeBits: numberOf(value.syndromeBits) };
  const testProbability = selectionMode === 'from-log' ? { testProbability: numberOf(value.generalTestProbability) } : {};
  return { generalAttack: { soundness: numberOf(value.generalSoundness), ...basis, ...testProbability } };
}
