import { splitCsvLine } from './csv-line';
import { ColumnMapping } from './column-mapping';
import { HeaderLayout, resolveHeader } from './header-layout';
import { LogProblem } from './log-problem';

/** Bytes of the decoded log looked at to find the header and to tell text from binary. */
export const HEAD_BYTES = 64 * 1024;

const BOM = [0xef, 0xbb, 0xbf];
const LF = 10;
const CR = 13;

/** Separators other labs' tools write instead of the comma, as a sentence names them. */
const FOREIGN_SEPARATORS: readonly (readonly [string, string])[] = [
  [';', 'semicolons (;)'],
  ['\t', 'tabs'],
  ['|', 'vertical bars (|)'],
];

/** The separator a one-column header line holds instead of commas, named for a sentence, or null. */
function foreignSeparatorIn(header: string): string | null {
  return FOREIGN_SEPARATORS.find(([separator]) => header.includes(separator))?.[1] ?? null;
}

/** The header of a log and where its data starts, or the problem that stops it being read. */
export type LogHead = { ok: true; layout: HeaderLayout; dataOffset: number } | { ok: false; problem: LogProblem };

/**
 * Reads the start of a decoded log (up to `HEAD_BYTES`; `complete` when that is the whole file):
 * skips a UTF-8 byte-order mark, refuses an empty or binary file (a NUL byte or invalid UTF-8), and
 * resolves the header line (line 1) under the column mapping.
 */
export function readLogHead(head: Uint8Array, complete: boolean, mapping: ColumnMapping, needsTestColumn: boolean): LogHead {
  const start = BOM.every((byte, i) => head[i] === byte) ? BOM.length : 0;
  const fail = (column: string | null, message: string): LogHead => ({ ok: false, problem: { line: 1, column, value: null, message } });
  if (head.subarray(start).every((byte) => byte === LF || byte === CR || byte === 32 || byte === 9)) {
    return fail(null, 'the file is empty: a round log needs a header line and at least one round');
  }
  const nul = head.indexOf(0);
  if (nul >= 0) {
    return fail(null, `the file looks binary (a zero byte at offset ${nul}), not a CSV round log`);
  }
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(head, { stream: !complete });
  } catch {
    return fail(null, 'the file is not UTF-8 text (it looks binary), not a CSV round log');
  }
  const newline = head.indexOf(LF, start);
  if (newline < 0 && !complete) {
    return fail(null, `the header line is longer than ${HEAD_BYTES} bytes`);
  }
  const end = newline < 0 ? head.length : newline;
  const text = new TextDecoder().decode(head.subarray(start, end > start && head[end - 1] === CR ? end - 1 : end));
  if (text.trim() === '') {
    return fail(null, 'the first line is empty: a round log starts with its header line');
  }
  const split = splitCsvLine(text);
  if ('error' in split) {
    return fail(null, `the header line's quoting is broken: ${split.error}`);
  }
  const separator = split.fields.length === 1 ? foreignSeparatorIn(text) : null;
  if (separator !== null) {
    return fail(null, `the header line is one column: its fields are separated by ${separator}, and a round log separates them with commas`);
  }
  const resolved = resolveHeader(split.fields, mapping, needsTestColumn);
  if (!resolved.ok) {
    return fail(resolved.column, resolved.message);
  }
  return { ok: true, layout: resolved.layout, dataOffset: newline < 0 ? head.length : newline + 1 };
}
