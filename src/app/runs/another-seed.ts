import type { AbstractControl, ValidationErrors } from '@angular/forms';

import { hexOf } from '../api/hex';

/** A seed's size: 32 bytes, 64 hex digits, as the server draws them. */
const SEED_BYTES = 32;
const SEED = /^[0-9a-f]{64}$/i;

/** A fresh seed drawn by the browser's cryptographic random source, 64 lowercase hex digits. */
export function randomSeed(): string {
  return hexOf(crypto.getRandomValues(new Uint8Array(SEED_BYTES)));
}

/** Refuses text that is not 64 hex digits (spaces around it ignored) as `{ seed: true }`; empty text is left to `required`. */
export function seedValidator(control: AbstractControl<string>): ValidationErrors | null {
  const seed = control.value.trim();
  return seed === '' || SEED.test(seed) ? null : { seed: true };
}
