import { splitCsvLine } from './csv-line';
import { HeaderLayout } from './header-layout';
import { parseIntegerField } from './integer-field';
import { FIELD } from './round-fields';

const LF = 10;
const CR = 13;
/** Longest unfinished line the keeper holds; a longer one is no round record (see `MAX_LINE_BYTES`). */
const LONGEST_KEPT_LINE = 1 << 20;

/**
 * The round indices at the edges of a log and of its stretches, read before the analysis pass:
 * test rounds are drawn over the triggers between the first and the last round index, so the
 * selection must know that span before it reads a round (see `selection/test-selector.ts`).
 */
export interface RecordEdges {
  /** Round index of the log's first record (NaN when it cannot be read: the log is then INVALID anyway). */
  firstRound: number;
  /** Round index of the log's last record (NaN likewise). */
  lastRound: number;
  /** For each stretch, the round index of the last record before it (NaN for the first stretch, or when unreadable). */
  previousRounds: number[];
}

/** Whether bytes [start, end) hold a blank line (nothing, or the CR of a CRLF). */
function isBlank(bytes: Uint8Array, start: number, end: number): boolean {
  return end === start || (end === start + 1 && bytes[start] === CR);
}

/** The first non-blank line of `bytes` (lines split at LF), without its line break; null if none. */
export function firstRecordLine(bytes: Uint8Array): Uint8Array | null {
  for (let start = 0; start < bytes.length;) {
    const newline = bytes.indexOf(LF, start);
    const end = newline < 0 ? bytes.length : newline;
    if (!isBlank(bytes, start, end)) return bytes.subarray(start, end);
    if (newline < 0) break;
    start = newline + 1;
  }
  return null;
}

/** The last non-blank line of `bytes`, which ends at a line end or at the end of the log; null if none. */
export function lastRecordLine(bytes: Uint8Array): Uint8Array | null {
  for (let lineEnd = bytes.length; ;) {
    const newline = lineEnd === 0 ? -1 : bytes.lastIndexOf(LF, lineEnd - 1);
    if (!isBlank(bytes, newline + 1, lineEnd)) return bytes.subarray(newline + 1, lineEnd);
    if (newline < 0) return null;
    lineEnd = newline;
  }
}

/** The round index written in one record line under the layout, or NaN when it cannot be read. */
export function roundOfLine(line: Uint8Array | null, layout: HeaderLayout): number {
  if (line === null) return NaN;
  const text = new TextDecoder().decode(line[line.length - 1] === CR ? line.subarray(0, line.length - 1) : line);
  const split = splitCsvLine(text);
  if ('error' in split) return NaN;
  const field = split.fields[layout.columnOfField[FIELD.round]];
  return field === undefined ? NaN : parseIntegerField(field);
}

/**
 * Keeps the last non-blank line of a stream of chunks (lines cut anywhere), for readers that cannot
 * seek to the end of the log (gzip, streams). Holds one line at most.
 */
export class LastLineKeeper {
  private tail: Uint8Array = new Uint8Array(0);
  private last: Uint8Array | null = null;

  /** Takes the next chunk. */
  push(chunk: Uint8Array): void {
    const newline = chunk.lastIndexOf(LF);
    if (newline < 0) {
      const joined = concat(this.tail, chunk);
      this.tail = joined.length > LONGEST_KEPT_LINE ? joined.slice(joined.length - LONGEST_KEPT_LINE) : joined;
      return;
    }
    // The last record is among the chunk's whole lines, else in the line the tail began (joined
    // only then, so an upload's chunks are not copied whole).
    const firstNewline = chunk.indexOf(LF);
    const last = lastRecordLine(chunk.subarray(firstNewline + 1, newline + 1)) ?? lastRecordLine(concat(this.tail, chunk.subarray(0, firstNewline + 1)));
    this.last = last?.slice() ?? this.last;
    this.tail = chunk.slice(newline + 1);
  }

  /** The last non-blank line seen, the unfinished one included. */
  finish(): Uint8Array | null {
    return lastRecordLine(this.tail) ?? this.last;
  }
}

function concat(head: Uint8Array, rest: Uint8Array): Uint8Array {
  if (head.length === 0) return rest;
  const joined = new Uint8Array(head.length + rest.length);
  joined.set(head);
  joined.set(rest, head.length);
  return joined;
}
