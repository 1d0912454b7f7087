import { type OutcomeEncoding, STATION_COLUMNS, StationLogReader, type StationLogSummary } from '@shared/analysis';
import type { StationName } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import type { LogSample } from './log-preview';

/**
 * What the start of a station's log says before it is sent: read by the engine's own station reader,
 * either clean (with how its outcomes are written) or the first problem that would make the night
 * INVALID, in a sentence.
 */
export type StationLogCheck = CleanStationLog | { ok: false; cause: 'file' | 'header' | 'rows'; message: string };

/** A station log's start that read cleanly. */
export interface CleanStationLog {
  ok: true;
  /** The outcome encoding under which the rows read cleanly. */
  outcomes: OutcomeEncoding;
  /** Records read from the start of the file (all of them when `complete`). */
  records: number;
  firstRound: number | null;
  lastRound: number | null;
  hasTimes: boolean;
  /** Whether the sample was the whole file. */
  complete: boolean;
}

/** One problem the engine's reader found. */
type StationLogProblem = StationLogSummary['problems'][number];

const LF = 10;

/** A clean start in a sentence: "All 3 rows read cleanly (rounds 1 to 4), with times; outcomes written 0/1." */
export function cleanCheckSentence(check: CleanStationLog): string {
  const rounds = check.firstRound === null || check.lastRound === null ? '' : ` (rounds ${formatCount(check.firstRound)} to ${formatCount(check.lastRound)})`;
  const rows = `${check.complete ? 'All' : 'The first'} ${formatCount(check.records)} ${check.records === 1 ? 'row reads' : 'rows read'} cleanly${rounds}`;
  return `${rows}, ${check.hasTimes ? 'with' : 'without'} times; outcomes written ${check.outcomes}.`;
}

/** Station A's columns in words: "round, x, a (and t_setting, t_outcome, both or neither)". */
export function stationColumnsText(station: StationName): string {
  const columns = STATION_COLUMNS[station];
  return `${columns.round}, ${columns.setting}, ${columns.outcome} (and ${columns.settingTime}, ${columns.outcomeTime}, both or neither)`;
}

/**
 * Reads the sample as `station`'s log, as the server will read the whole file: the header against
 * the station's columns, then each row (fields, settings, outcomes, times, increasing rounds).
 * Outcomes are taken as 0/1 unless only ±1 reads cleanly. A sample cut off by its size is read up to
 * its last whole line.
 */
export async function checkStationLog(sample: LogSample, station: StationName): Promise<StationLogCheck> {
  const plain = await readSample(sample, station, '0/1');
  const first = plain.problems[0];
  if (first === undefined) return clean(plain, '0/1', sample.complete);
  // A header or file problem is the same under either encoding.
  if (first.line === 1) return refusal(first, plain.problemCount, station);
  const signed = await readSample(sample, station, '±1');
  if (signed.problemCount === 0) return clean(signed, '±1', sample.complete);
  // The reading with fewer problems tells the real one, not a wrong guess of the encoding.
  const told = signed.problemCount < plain.problemCount ? signed : plain;
  return refusal(told.problems[0], told.problemCount, station);
}

async function readSample(sample: LogSample, station: StationName, outcomes: OutcomeEncoding): Promise<StationLogSummary> {
  const reader = new StationLogReader(station, outcomes);
  const bytes = sample.complete ? sample.head : sample.head.subarray(0, sample.head.lastIndexOf(LF) + 1);
  // The rows themselves are not needed: the reader's summary counts them and keeps the problems.
  for await (const _rows of reader.rows(once(bytes)));
  return reader.summary();
}

/** The bytes as a stream of one chunk, the reader's kind of input. */
function once(bytes: Uint8Array): AsyncIterable<Uint8Array> {
  return {
    [Symbol.asyncIterator]: () => {
      let given = false;
      return {
        next: (): Promise<IteratorResult<Uint8Array>> => {
          const done = given;
          given = true;
          return Promise.resolve(done ? { done: true, value: undefined } : { done: false, value: bytes });
        },
      };
    },
  };
}

function clean(summary: StationLogSummary, outcomes: OutcomeEncoding, complete: boolean): StationLogCheck {
  const { records, firstRound, lastRound, layout } = summary;
  return { ok: true, outcomes, records, firstRound, lastRound, hasTimes: layout?.hasTimes ?? false, complete };
}

/** The first problem in a sentence: the file itself, its header (naming what was expected), or a row. */
function refusal(problem: StationLogProblem, count: number, station: StationName): StationLogCheck {
  if (problem.line === 1 && problem.column === null) return { ok: false, cause: 'file', message: `This file cannot be read as a round log: ${problem.message}.` };
  if (problem.line === 1) {
    return {
      ok: false,
      cause: 'header',
      message: `This is not station ${station}'s log as Bellkeep reads it: ${problem.message}. Station ${station}'s log has the columns ${stationColumnsText(station)}.`,
    };
  }
  const where = `line ${problem.line}${problem.column === null ? '' : `, column ${problem.column}`}${problem.value === null ? '' : ` (“${problem.value}”)`}`;
  const more = count > 1 ? ` ${count - 1} more ${count === 2 ? 'problem follows' : 'problems follow'} in the first rows.` : '';
  return { ok: false, cause: 'rows', message: `A row breaks the log rules, so the night would be INVALID: ${where}: ${problem.message}.${more}` };
}

/** A station's picked log and what its start says (null while it is read). */
export interface PickedCheck {
  readonly station: StationName;
  readonly check: StationLogCheck | null;
}

/**
 * Why the picked station logs cannot be sent as they are, or empty when they can: none picked, one
 * still being read, one that would make the night INVALID, a profile that needs the joined log's own
 * test column, or the two logs writing outcomes two ways (a night's logs are read one way).
 */
export function stationLogsRefusal(picked: readonly PickedCheck[], needsTestColumn: boolean): string {
  if (picked.length === 0) return 'Choose station A’s log, station B’s, or both.';
  if (picked.some(({ check }) => check === null)) return 'Reading the start of the logs…';
  const refused = picked.find(({ check }) => !check!.ok);
  if (refused) return `Station ${refused.station}’s log would make the night INVALID: choose another file or correct it.`;
  if (needsTestColumn) return 'The profile takes its test rounds from the log’s own test column, which station logs do not have: upload one joined log instead.';
  const written = picked.map(({ station, check }) => `station ${station}’s as ${(check as CleanStationLog).outcomes}`);
  if (new Set(picked.map(({ check }) => (check as CleanStationLog).outcomes)).size > 1) {
    return `The logs write outcomes two ways, ${written.join(' and ')}: a night’s two logs are read one way.`;
  }
  return '';
}
