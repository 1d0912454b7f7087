import { z } from 'zod';
import { ROUND_FIELDS } from './round-fields';

/** How outcomes a, b are written: `0/1` as in the trade's notation, or `±1` (+1 → 0, −1 → 1). */
export const OUTCOME_ENCODINGS = ['0/1', '±1'] as const;

/** How outcomes are written in the log. */
export type OutcomeEncoding = (typeof OUTCOME_ENCODINGS)[number];

/** Which header names hold which field, and how outcomes are written. */
export const columnMappingSchema = z.strictObject({
  /** Header name for each field; a field left out keeps its own name (`round`, `x`, `y`, `a`, `b`, `test`). */
  columns: z
    .partialRecord(
      z.enum(ROUND_FIELDS, { error: `must be one of ${ROUND_FIELDS.join(', ')}` }),
      z.string({ error: 'must be a header name' }).min(1, { error: 'must not be empty' }),
    )
    .default({}),
  /** How outcomes are written. Default `0/1`. */
  outcomes: z.enum(OUTCOME_ENCODINGS, { error: `must be one of ${OUTCOME_ENCODINGS.join(', ')}` }).default('0/1'),
});

/** A complete column mapping, defaults filled in. */
export type ColumnMapping = z.output<typeof columnMappingSchema>;

/** Either a mapping or the first problem, naming the field. */
export type MappingParse = { ok: true; mapping: ColumnMapping } | { ok: false; message: string };

/** Validates a column mapping; a bad one gets a message naming the field. */
export function parseColumnMapping(input: unknown): MappingParse {
  const parsed = columnMappingSchema.safeParse(input ?? {});
  if (parsed.success) {
    return { ok: true, mapping: parsed.data };
  }
  const issue = parsed.error.issues[0];
  const path = [...issue.path, ...(issue.code === 'unrecognized_keys' ? issue.keys.slice(0, 1) : [])].map(String).join('.') || '(mapping)';
  const message = issue.code === 'unrecognized_keys' ? 'unknown field' : issue.message;
  return { ok: false, message: `mapping field ${path}: ${message}` };
}

/** The header name that holds `field` under `mapping`. */
export function headerNameOf(field: (typeof ROUND_FIELDS)[number], mapping: ColumnMapping): string {
  return mapping.columns[field] ?? field;
}
