import {
  type ColumnMapping,
  HEAD_BYTES,
  headerNameOf,
  type OutcomeEncoding,
  parseIntegerField,
  ProblemList,
  readLogHead,
  RecordChecker,
  ROUND_FIELDS,
  type RoundField,
  splitCsvLine,
} from '@shared/analysis';

/** The first bytes of a log, decompressed when it is gzip. */
export interface LogSample {
  /** Up to `HEAD_BYTES` of the decoded log. */
  readonly head: Uint8Array;
  /** Whether `head` is the whole decoded log. */
  readonly complete: boolean;
  readonly compressed: boolean;
}

/** One previewed row: its fields as written and the round read from them, or the problems found. */
export interface PreviewRow {
  readonly line: number;
  readonly fields: string[];
  /** The decoded round (outcomes as 0/1), or null when the row breaks a rule. */
  readonly round: Record<RoundField, number> | null;
  readonly problems: string[];
}

/**
 * The preview under a mapping: the rows, or why they cannot be read: the file itself (empty, binary,
 * no header line) or a header that does not fit the mapping.
 */
export type LogPreview = { ok: true; columns: string[]; rows: PreviewRow[] } | { ok: false; cause: 'file' | 'mapping'; message: string };

/** Rows the preview shows. */
export const PREVIEW_ROWS = 12;

const GZIP_MAGIC = [0x1f, 0x8b];
const BOM = [0xef, 0xbb, 0xbf];
const LF = 10;

/** Reads the start of a log file, through the browser's own gzip decoder when it begins with the gzip magic bytes. */
export async function readLogSample(file: Blob): Promise<LogSample> {
  const start = await bytesOf(file.slice(0, 2));
  const compressed = GZIP_MAGIC.every((byte, i) => start[i] === byte);
  if (!compressed) {
    const head = await bytesOf(file.slice(0, HEAD_BYTES));
    return { head, complete: file.size <= HEAD_BYTES, compressed };
  }
  const reader = file.stream().pipeThrough(new DecompressionStream('gzip')).getReader();
  const head = new Uint8Array(HEAD_BYTES);
  let length = 0;
  let complete = false;
  while (length < HEAD_BYTES) {
    const { done, value } = await reader.read();
    if (done) {
      complete = true;
      break;
    }
    const taken = value.subarray(0, HEAD_BYTES - length);
    head.set(taken, length);
    length += taken.length;
  }
  await reader.cancel().catch(() => undefined);
  return { head: head.subarray(0, length), complete, compressed };
}

/** The bytes of a blob, through FileReader (which every browser and the test DOM have). */
function bytesOf(blob: Blob): Promise<Uint8Array> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(new Uint8Array(reader.result as ArrayBuffer));
    reader.onerror = () => reject(reader.error ?? new Error('The file could not be read.'));
    reader.readAsArrayBuffer(blob);
  });
}

/** The header names of a sample (line 1, after a byte-order mark), or none when line 1 cannot be split. */
export function headerNames(sample: LogSample): string[] {
  const { head } = sample;
  const start = BOM.every((byte, i) => head[i] === byte) ? BOM.length : 0;
  const newline = head.indexOf(LF, start);
  const line = new TextDecoder().decode(head.subarray(start, newline < 0 ? head.length : newline)).replace(/\r$/, '');
  const split = splitCsvLine(line);
  return 'error' in split ? [] : split.fields.map((name) => name.trim()).filter((name) => name !== '');
}

/** Header words that name each field, tried in order when no column has the field's own name. */
const FIELD_HINTS: Record<RoundField, RegExp> = {
  round: /round|index|^n$|^i$/i,
  test: /test|mark/i,
  x: /set|choice|basis/i,
  y: /set|choice|basis/i,
  a: /out|result|click|bit/i,
  b: /out|result|click|bit/i,
};

/**
 * A column mapping guessed from the header: a column with a field's own name (any case) first;
 * otherwise a name with a telling word (settings and outcomes in header order, station A first).
 * Outcomes are `±1` when the sample's outcome columns hold a −1 or +1.
 */
export function guessMapping(sample: LogSample): ColumnMapping {
  const names = headerNames(sample);
  const taken = new Set<string>();
  const columns: Partial<Record<RoundField, string>> = {};
  for (const field of ROUND_FIELDS) {
    const own = names.find((name) => name.toLowerCase() === field);
    if (own !== undefined) {
      columns[field] = own;
      taken.add(own);
    }
  }
  for (const field of ['round', 'test', 'x', 'y', 'a', 'b'] as const) {
    if (columns[field] !== undefined) continue;
    const hinted = names.find((name) => !taken.has(name) && FIELD_HINTS[field].test(name));
    if (hinted !== undefined) {
      columns[field] = hinted;
      taken.add(hinted);
    }
  }
  return { columns, outcomes: outcomeEncoding(sample, names, [columns.a, columns.b]) };
}

/** The mapping an upload starts from, and where it came from in a sentence. */
export interface StartingMapping {
  mapping: ColumnMapping;
  /** Empty when the mapping was guessed and no saved one was there to try. */
  note: string;
}

/**
 * The mapping to start from: the setup's saved one when the header fits it, else the guess from the
 * header, saying why the saved one was not used.
 */
export function startingMapping(sample: LogSample, saved: ColumnMapping | null, setupName: string, needsTestColumn: boolean): StartingMapping {
  if (saved === null) return { mapping: guessMapping(sample), note: '' };
  const head = readLogHead(sample.head, sample.complete, saved, needsTestColumn);
  if (head.ok) return { mapping: saved, note: `Filled in from the mapping saved for ${setupName}.` };
  return { mapping: guessMapping(sample), note: `The mapping saved for ${setupName} does not fit this file (${head.problem.message}); the columns are guessed from its header.` };
}

/** Whether two mappings read every field from the same column, with the same outcome encoding. */
export function sameMapping(one: ColumnMapping, other: ColumnMapping): boolean {
  return one.outcomes === other.outcomes && ROUND_FIELDS.every((field) => headerNameOf(field, one) === headerNameOf(field, other));
}

function outcomeEncoding(sample: LogSample, names: string[], outcomeColumns: (string | undefined)[]): OutcomeEncoding {
  const indices = outcomeColumns.flatMap((name) => (name === undefined ? [] : [names.indexOf(name)]));
  const signed = dataLines(sample, PREVIEW_ROWS).some(({ text }) => {
    const split = splitCsvLine(text);
    return !('error' in split) && indices.some((index) => /^[+-]1$/.test(split.fields[index]?.trim() ?? ''));
  });
  return signed ? '±1' : '0/1';
}

/**
 * The first rows of the sample read under `mapping` by the engine's own rules: the header resolved as
 * the analysis resolves it, each row checked (field count, integers, ranges, increasing rounds).
 */
export function previewLog(sample: LogSample, mapping: ColumnMapping, needsTestColumn: boolean, rows = PREVIEW_ROWS): LogPreview {
  const head = readLogHead(sample.head, sample.complete, mapping, needsTestColumn);
  if (!head.ok) {
    // A header that does not fit the mapping names the column it looked for; the file's own problems name none.
    return { ok: false, cause: head.problem.column === null ? 'file' : 'mapping', message: head.problem.message };
  }
  const { layout } = head;
  const lines = dataLines(sample, rows, head.dataOffset);
  if (lines.length === 0 && sample.complete) {
    return { ok: false, cause: 'file', message: 'the file has its header line but no rounds' };
  }
  const problems = new ProblemList();
  const checker = new RecordChecker(layout, problems);
  const values = new Float64Array(ROUND_FIELDS.length);
  const previewRows = lines.map(({ line, text }): PreviewRow => {
    const before = problems.listed.length;
    const split = splitCsvLine(text);
    if ('error' in split) {
      checker.malformed(line, text, `the row's quoting is broken: ${split.error}`);
      return { line, fields: [text], round: null, problems: problems.listed.slice(before).map((problem) => problem.message) };
    }
    const fields = split.fields;
    ROUND_FIELDS.forEach((_, field) => {
      const column = layout.columnOfField[field];
      values[field] = column < 0 ? NaN : parseIntegerField(fields[column] ?? '');
    });
    const valid = checker.accept(line, values, fields.length, () => fields);
    const round = valid ? (Object.fromEntries(ROUND_FIELDS.map((name, field) => [name, checker.decoded[field]])) as Record<RoundField, number>) : null;
    return { line, fields, round, problems: problems.listed.slice(before).map((problem) => problem.message) };
  });
  return { ok: true, columns: layout.columnNames.map((name) => name.trim()), rows: previewRows };
}

/** The complete data lines of a sample after the header (a last line cut off by the sample's end is left out). */
function dataLines(sample: LogSample, limit: number, offset = sample.head.indexOf(LF) + 1): { line: number; text: string }[] {
  const { head } = sample;
  const lines: { line: number; text: string }[] = [];
  const decoder = new TextDecoder();
  let position = offset === 0 ? head.length : offset;
  // The header is line 1.
  for (let line = 2; lines.length < limit && position < head.length; line++) {
    const newline = head.indexOf(LF, position);
    if (newline < 0 && !sample.complete) break;
    const end = newline < 0 ? head.length : newline;
    const text = decoder.decode(head.subarray(position, end)).replace(/\r$/, '');
    if (text.trim() !== '') lines.push({ line, text });
    position = end + 1;
  }
  return lines;
}
