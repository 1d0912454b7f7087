import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

/** Digits grouped in threes by commas: 2,000,000. */
const COMMA_GROUPED = /^\d{1,3}(,\d{3})+$/;
/** A decimal number, optionally with a power of ten: 2000000, 2e6, 2.5E+6. */
const DECIMAL = /^\d+(\.\d+)?(e\+?\d+)?$/i;

/**
 * A number of rounds as people write it: `2000000`, `2 000 000` (any kind of space, thin ones
 * included), `2,000,000`, `2e6` or `2.5e6`.
 *
 * @returns the whole, positive number of rounds, or null when the text is not one.
 * @example parseRoundCount('2 000 000') === 2_000_000; parseRoundCount('1.5') === null
 */
export function parseRoundCount(text: string): number | null {
  const compact = text.replace(/\s/g, '');
  const plain = COMMA_GROUPED.test(compact) ? compact.replace(/,/g, '') : compact;
  if (!DECIMAL.test(plain)) return null;
  const rounds = Number(plain);
  return Number.isSafeInteger(rounds) && rounds > 0 ? rounds : null;
}

/** Refuses text that {@link parseRoundCount} cannot read, as `{ roundCount: true }`; empty text is left to `required`. */
export const roundCountValidator: ValidatorFn = (control: AbstractControl<string | null>): ValidationErrors | null => {
  const text = control.value?.trim() ?? '';
  return text === '' || parseRoundCount(text) !== null ? null : { roundCount: true };
};
