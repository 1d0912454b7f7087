import { ColumnMapping, headerNameOf, OutcomeEncoding } from './column-mapping';
import { FIELD_MEANING, REQUIRED_FIELDS, ROUND_FIELDS, RoundField } from './round-fields';

/** Where each field sits in a row, resolved from the header. Plain data, so it can go to a worker. */
export interface HeaderLayout {
  /** Number of fields every row must have. */
  fieldCount: number;
  /** For each column, the index of the round field it holds (see `FIELD`), or −1 for extra columns. */
  fieldOfColumn: number[];
  /** For each round field, its column index, or −1 when the log has no such column. */
  columnOfField: number[];
  /** The header names, as written. */
  columnNames: string[];
  /** How outcomes are written. */
  outcomes: OutcomeEncoding;
}

/** A header layout, or why the header cannot be used. */
export type HeaderResolution = { ok: true; layout: HeaderLayout } | { ok: false; column: string | null; message: string };

/**
 * Resolves the header names to round fields under the mapping. Names are compared after trimming
 * spaces; a required field without a column, or a mapped name that appears twice, is a problem.
 */
export function resolveHeader(names: string[], mapping: ColumnMapping, needsTestColumn: boolean): HeaderResolution {
  const trimmed = names.map((name) => name.trim());
  const columnOfField = ROUND_FIELDS.map(() => -1);
  const fieldOfColumn = trimmed.map(() => -1);
  for (const [field, fieldIndex] of ROUND_FIELDS.map((f, i) => [f, i] as const)) {
    const wanted = headerNameOf(field, mapping);
    const columns = trimmed.flatMap((name, column) => (name === wanted ? [column] : []));
    if (columns.length > 1) {
      return { ok: false, column: wanted, message: `the header names column "${wanted}" (${FIELD_MEANING[field]}) ${columns.length} times` };
    }
    if (columns.length === 1) {
      columnOfField[fieldIndex] = columns[0];
      fieldOfColumn[columns[0]] = fieldIndex;
    }
  }
  const required: RoundField[] = needsTestColumn ? [...REQUIRED_FIELDS, 'test'] : [...REQUIRED_FIELDS];
  const missing = required.find((field) => columnOfField[ROUND_FIELDS.indexOf(field)] < 0);
  if (missing) {
    const wanted = headerNameOf(missing, mapping);
    const why = missing === 'test' ? ' (the profile selects test rounds from the log)' : '';
    return {
      ok: false,
      column: wanted,
      message: `the header has no column "${wanted}" for the ${FIELD_MEANING[missing]}${why}; it has: ${trimmed.join(', ')}`,
    };
  }
  return { ok: true, layout: { fieldCount: names.length, fieldOfColumn, columnOfField, columnNames: names, outcomes: mapping.outcomes } };
}
