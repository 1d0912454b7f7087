import { type ColumnMapping, headerNameOf } from '../analysis/log/column-mapping';
import { ROUND_FIELDS, type RoundField } from '../analysis/log/round-fields';

/**
 * A column mapping in one line, as the report, the trail and the upload page write it:
 * `round ← “RoundNo”, x ← “SetNorth”, …; outcomes written ±1`. `fields` limits the line to the
 * fields that matter (the report leaves out `test` when the log's test column is not read).
 */
export function mappingWords(mapping: ColumnMapping, fields: readonly RoundField[] = ROUND_FIELDS): string {
  return `${fields.map((field) => `${field} ← “${headerNameOf(field, mapping)}”`).join(', ')}; outcomes written ${mapping.outcomes}`;
}

/** A saved mapping by the columns it names (`x ← “SetNorth”, …; outcomes written ±1`), the others keeping their own names. */
export function savedMappingWords(mapping: ColumnMapping): string {
  const named = ROUND_FIELDS.filter((field) => mapping.columns[field] !== undefined);
  return named.length === 0 ? `each field under its own name; outcomes written ${mapping.outcomes}` : mappingWords(mapping, named);
}
