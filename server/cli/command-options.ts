/** A command-line mistake: the command prints it with its usage and exits 2. */
export class UsageError extends Error {}

/** Parsed option values, as node:util `parseArgs` gives them. */
export type OptionValues = Record<string, string | boolean | undefined>;

/**
 * A number option, or undefined when absent: "1.5e6", "1500000" and "1_500_000" all read, and a
 * fraction such as "13/256" (test probabilities are often chosen as one).
 */
export function numberOption(values: OptionValues, name: string): number | undefined {
  const text = values[name];
  if (text === undefined) return undefined;
  if (typeof text !== 'string') throw new UsageError(`--${name} needs a number`);
  const parts = text.replaceAll('_', '').split('/');
  const [numerator, denominator = 1] = parts.map((part) => (part.trim() === '' ? NaN : Number(part)));
  const value = numerator / denominator;
  if (parts.length > 2 || !Number.isFinite(value)) throw new UsageError(`--${name} must be a number; it is ${JSON.stringify(text)}`);
  return value;
}
