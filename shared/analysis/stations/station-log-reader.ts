import { OutcomeEncoding } from '../log/column-mapping';
import { HEAD_BYTES } from '../log/log-head';
import { LogProblem, ProblemList } from '../log/log-problem';
import { MAX_LINE_BYTES } from '../log/byte-scanner';
import { FIRST_DATA_LINE } from '../log/range-plans';
import { Station } from './station-columns';
import { readStationHead } from './station-head';
import { StationLayout } from './station-header';
import { LineSplitter } from './station-lines';
import { StationRecordChecker } from './station-record-checker';
import { StationBatch } from './station-batch';
import { StationRowScanner } from './station-row-scanner';

/** What reading one station log found. */
export interface StationLogSummary {
  /** Whose log it is. */
  station: Station;
  /** The resolved header, or null when the head could not be read. */
  layout: StationLayout | null;
  /** Records (non-blank lines after the header) read. */
  records: number;
  /** Valid rows handed on. */
  rows: number;
  /** The first and last readable round index, or null. */
  firstRound: number | null;
  lastRound: number | null;
  /** Round indices missing from this log between its first and last (its own trigger count's gaps). */
  gaps: number;
  /** The first problems, in order (`LISTED_PROBLEMS` of them at most). */
  problems: LogProblem[];
  /** All problems found; any makes the station log unusable, as any bad row makes a joined log INVALID. */
  problemCount: number;
}

/** Rows per batch handed on at most. */
export const STATION_BATCH_ROWS = 8192;

/**
 * Reads one station's log, `round,x,a[,t_setting,t_outcome]` at station A or `round,y,b[,…]` at
 * station B (any column order, other columns ignored, LF or CRLF, a UTF-8 BOM, quoting as RFC 4180
 * on one line), from decoded bytes cut anywhere, with the joined log's strictness: each bad row is a
 * problem naming line, column and value, and is not handed on. Holds one chunk of bytes and one
 * batch of rows at a time.
 */
export class StationLogReader {
  private readonly problems = new ProblemList();
  private layout: StationLayout | null = null;
  private checker: StationRecordChecker | null = null;
  private records = 0;
  private rowCount = 0;
  private nextLine = FIRST_DATA_LINE;

  constructor(
    readonly station: Station,
    private readonly outcomes: OutcomeEncoding = '0/1',
  ) {}

  /**
   * The valid rows, in batches of at most `STATION_BATCH_ROWS` (never an empty one). The same batch
   * is refilled: its rows are valid until the next is asked for. Reads the chunks once.
   */
  async *rows(chunks: AsyncIterable<Uint8Array>): AsyncGenerator<StationBatch> {
    const iterator = chunks[Symbol.asyncIterator]();
    const head: Uint8Array[] = [];
    let headLength = 0;
    let ended = false;
    while (headLength < HEAD_BYTES && !ended) {
      const next = await iterator.next();
      if (next.done === true) {
        ended = true;
      } else {
        head.push(next.value);
        headLength += next.value.length;
      }
    }
    const headBytes = joined(head, headLength);
    const read = readStationHead(headBytes.subarray(0, HEAD_BYTES), headBytes.length <= HEAD_BYTES && ended, this.station, this.outcomes);
    if (!read.ok) {
      this.problems.add(read.problem.line, read.problem.column, read.problem.value, read.problem.message);
      await iterator.return?.();
      return;
    }
    const layout = read.layout;
    const checker = new StationRecordChecker(layout, this.problems);
    this.layout = layout;
    this.checker = checker;
    const batch = new StationBatch(STATION_BATCH_ROWS, layout.hasTimes);
    const splitter = new LineSplitter(
      FIRST_DATA_LINE,
      (line, text) => {
        this.records++;
        const row = checker.acceptText(line, text);
        if (row !== null) batch.push(row);
      },
      (line, start) => {
        this.records++;
        this.problems.add(line, null, `${start}…`, `the line is longer than ${MAX_LINE_BYTES} bytes: not a round record`);
      },
    );
    const scanner = new StationRowScanner(layout, checker, splitter, () => this.records++);
    const handOn = () => {
      this.rowCount += batch.length;
      return batch;
    };
    try {
      for (let chunk = headBytes.subarray(read.dataOffset); ;) {
        for (let at = 0; at < chunk.length;) {
          at = scanner.scan(chunk, at, chunk.length, batch);
          if (batch.full) {
            yield handOn();
            batch.length = 0;
          }
        }
        if (ended) break;
        const next = await iterator.next();
        if (next.done === true) {
          ended = true;
          break;
        }
        chunk = next.value;
      }
    } finally {
      this.nextLine = splitter.nextLine;
      // A reader stopped early (or failing bytes) leaves the source to be closed here.
      if (!ended) await iterator.return?.();
    }
    splitter.finish();
    this.nextLine = splitter.nextLine;
    if (batch.length > 0) yield handOn();
    if (this.records === 0) {
      this.problems.add(FIRST_DATA_LINE, null, null, 'the log has a header but no rounds');
    }
  }

  /**
   * Records a failure of the bytes themselves (damaged or bomb-like gzip data) as a problem on the
   * line after the last one read, as the joined log's reader reports it.
   */
  fail(message: string): void {
    this.problems.add(this.nextLine, null, null, message);
  }

  /** What the reading found so far. */
  summary(): StationLogSummary {
    return {
      station: this.station,
      layout: this.layout,
      records: this.records,
      rows: this.rowCount,
      firstRound: this.checker?.first?.round ?? null,
      lastRound: this.checker?.last?.round ?? null,
      gaps: this.checker?.gaps ?? 0,
      problems: this.problems.listed,
      problemCount: this.problems.count,
    };
  }
}

/** The chunks as one array of bytes. */
function joined(chunks: readonly Uint8Array[], length: number): Uint8Array {
  if (chunks.length === 1) return chunks[0];
  const bytes = new Uint8Array(length);
  let at = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, at);
    at += chunk.length;
  }
  return bytes;
}
