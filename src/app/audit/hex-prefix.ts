import type { AbstractControl, FormControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { ErrorStateMatcher } from '@angular/material/core';

import { RUN_SEARCH_MIN_PREFIX } from '@shared/api';

/** Hex digits of a SHA-256 (and of a result fingerprint): no prefix can be longer. */
const FULL_HASH_DIGITS = 64;

/**
 * What is wrong with `text` as the start of a hash to search by, or null when it will do (an
 * empty field searches by nothing). Spaces around it are ignored; either case of a–f is taken.
 */
export function hexPrefixProblem(text: string): string | null {
  const prefix = text.trim();
  if (prefix === '') return null;
  if (!/^[0-9a-f]+$/i.test(prefix)) return 'Use only the digits 0–9 and the letters a–f.';
  if (prefix.length < RUN_SEARCH_MIN_PREFIX) return `Give at least ${RUN_SEARCH_MIN_PREFIX} hexadecimal digits.`;
  if (prefix.length > FULL_HASH_DIGITS) return `A hash has ${FULL_HASH_DIGITS} hexadecimal digits at most.`;
  return null;
}

/** `hexPrefixProblem` as a form validator: the error `hexPrefix` carries the sentence to show. */
export const hexPrefixValidator: ValidatorFn = (control: AbstractControl<string | null>): ValidationErrors | null => {
  const problem = hexPrefixProblem(control.value ?? '');
  return problem === null ? null : { hexPrefix: problem };
};

/** The prefix as the API takes it, or null for an empty field. */
export function hexPrefixQuery(control: FormControl<string | null>): string | null {
  const prefix = control.value?.trim().toLowerCase() ?? '';
  return prefix === '' ? null : prefix;
}

/** Shows a field's error while it is typed in, not only once it is left: a pasted hash is judged at once. */
export const WHILE_TYPING: ErrorStateMatcher = {
  isErrorState: (control) => control !== null && control.invalid && (control.dirty || control.touched),
};
