import { OutcomeEncoding } from '../log/column-mapping';
import { otherStation, REQUIRED_STATION_FIELDS, Station, STATION_COLUMNS, STATION_FIELDS, stationFieldMeaning, TIME_FIELDS } from './station-columns';

/** Where each field of a station record sits in a row, resolved from the header. */
export interface StationLayout {
  /** Whose log it is. */
  station: Station;
  /** Number of fields every row must have. */
  fieldCount: number;
  /** For each field of `STATION_FIELDS`, its column index, or −1 when the log has no such column. */
  columnOfField: number[];
  /** The header names, as written. */
  columnNames: string[];
  /** How outcomes are written. */
  outcomes: OutcomeEncoding;
  /** Whether the log has the two time columns. */
  hasTimes: boolean;
}

/** A station layout, or why the header cannot be used (naming the column when there is one). */
export type StationHeaderResolution = { ok: true; layout: StationLayout } | { ok: false; column: string | null; message: string };

/**
 * Resolves a station log's header names (trimmed) to its fields, as the joined log's header is
 * resolved: a required field without a column or a field's column named twice is a problem, other
 * columns are left alone. The two time columns come together or not at all.
 */
export function resolveStationHeader(names: readonly string[], station: Station, outcomes: OutcomeEncoding): StationHeaderResolution {
  const trimmed = names.map((name) => name.trim());
  const wanted = STATION_COLUMNS[station];
  const columnOfField = STATION_FIELDS.map(() => -1);
  for (const [index, field] of STATION_FIELDS.entries()) {
    const columns = trimmed.flatMap((name, column) => (name === wanted[field] ? [column] : []));
    if (columns.length > 1) {
      return { ok: false, column: wanted[field], message: `the header names column "${wanted[field]}" (${stationFieldMeaning(station, field)}) ${columns.length} times` };
    }
    columnOfField[index] = columns[0] ?? -1;
  }
  const has = (field: (typeof STATION_FIELDS)[number]) => columnOfField[STATION_FIELDS.indexOf(field)] >= 0;
  const missing = REQUIRED_STATION_FIELDS.find((field) => !has(field));
  if (missing !== undefined) {
    return {
      ok: false,
      column: wanted[missing],
      message: `the header has no column "${wanted[missing]}" for the ${stationFieldMeaning(station, missing)}; it has: ${trimmed.join(', ')}${otherStationHint(trimmed, station)}`,
    };
  }
  const times = TIME_FIELDS.filter(has);
  if (times.length === 1) {
    const [present] = times;
    const absent = TIME_FIELDS.find((field) => field !== present) ?? present;
    return { ok: false, column: wanted[present], message: `the header has column "${wanted[present]}" but no "${wanted[absent]}": a station log gives both times or neither` };
  }
  return { ok: true, layout: { station, fieldCount: names.length, columnOfField, columnNames: [...names], outcomes, hasTimes: times.length === 2 } };
}

/** " (it looks like station B's log)" when the header holds the other station's setting and outcome columns. */
function otherStationHint(trimmed: readonly string[], station: Station): string {
  const other = otherStation(station);
  const theirs = STATION_COLUMNS[other];
  return trimmed.includes(theirs.setting) && trimmed.includes(theirs.outcome) ? ` (it looks like station ${other}'s log)` : '';
}
