import { splitCsvLine } from '../log/csv-line';
import { OutcomeEncoding } from '../log/column-mapping';
import { readLogHead } from '../log/log-head';
import { LogProblem } from '../log/log-problem';
import { Station } from './station-columns';
import { resolveStationHeader, StationLayout } from './station-header';

const BOM = [0xef, 0xbb, 0xbf];
const LF = 10;
const CR = 13;

/** The joined log's own mapping: only its text checks are used here, never its columns. */
const JOINED_DEFAULTS = { columns: {}, outcomes: '0/1' } as const;

/** The header of a station log and where its data starts, or the problem that stops it being read. */
export type StationHead = { ok: true; layout: StationLayout; dataOffset: number } | { ok: false; problem: LogProblem };

/**
 * Reads the start of a decoded station log (up to `HEAD_BYTES`; `complete` when that is the whole
 * file) with the joined log's own rules: `readLogHead` refuses an empty or binary file, invalid
 * UTF-8, broken quoting in the header and a header separated by something other than commas (each
 * such problem has no column). Its verdict on the joined log's columns (a problem naming a column,
 * or none) is set aside, and the header line is resolved as a station's instead.
 */
export function readStationHead(head: Uint8Array, complete: boolean, station: Station, outcomes: OutcomeEncoding): StationHead {
  const text = readLogHead(head, complete, JOINED_DEFAULTS, false);
  if (!text.ok && text.problem.column === null) {
    return text;
  }
  const start = BOM.every((byte, i) => head[i] === byte) ? BOM.length : 0;
  const newline = head.indexOf(LF, start);
  const end = newline < 0 ? head.length : newline;
  const line = new TextDecoder().decode(head.subarray(start, end > start && head[end - 1] === CR ? end - 1 : end));
  const split = splitCsvLine(line);
  // readLogHead has split this very line without error; the guard only satisfies the type.
  const names = 'fields' in split ? split.fields : [line];
  const resolved = resolveStationHeader(names, station, outcomes);
  if (!resolved.ok) {
    return { ok: false, problem: { line: 1, column: resolved.column, value: null, message: resolved.message } };
  }
  return { ok: true, layout: resolved.layout, dataOffset: newline < 0 ? head.length : newline + 1 };
}
