const INTEGER = /^[+-]?[0-9]+$/;

/**
 * Reads a field as an integer: optional sign, then ASCII digits, nothing else (no spaces, no
 * decimal point). Returns NaN for anything else. Values beyond 2^53 come back inexact, and the
 * range rules reject them.
 */
export function parseIntegerField(text: string): number {
  return INTEGER.test(text) ? Number(text) : NaN;
}
