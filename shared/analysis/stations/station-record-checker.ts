import { splitCsvLine } from '../log/csv-line';
import { parseIntegerField } from '../log/integer-field';
import { ProblemList } from '../log/log-problem';
import { recordOrder, RoundMark } from '../log/record-checker';
import { parsePicosecondTime } from './picosecond-time';
import { PlainRowReader } from './plain-row-reader';
import { ALLOWED_SETTINGS, SETTING_RULE, Station, STATION_FIELDS, StationField, stationFieldMeaning } from './station-columns';
import { StationLayout } from './station-header';
import { StationRow } from './station-row';

/** The largest round index, as in a joined log. */
const LARGEST_ROUND = Number.MAX_SAFE_INTEGER;

const ROUND = STATION_FIELDS.indexOf('round');
const SETTING = STATION_FIELDS.indexOf('setting');
const OUTCOME = STATION_FIELDS.indexOf('outcome');
const SETTING_TIME = STATION_FIELDS.indexOf('settingTime');
const OUTCOME_TIME = STATION_FIELDS.indexOf('outcomeTime');

/**
 * Checks the records of one station log with the joined log's rules (field count, integers, ranges,
 * round indices strictly increasing: `recordOrder` names a repeat or a step back) plus the time
 * fields (`parsePicosecondTime`), and decodes them. Each bad field is a problem naming its line,
 * column and the text as written; a row with a problem gives no row.
 */
export class StationRecordChecker {
  /** Round indices missing between consecutive readable rows. */
  gaps = 0;
  /** The first readable round index and its line. */
  first: RoundMark | null = null;
  /** The last readable round index and its line (NaN and 0 before the first). */
  private previousRound = NaN;
  private previousLine = 0;
  private readonly roundColumn: string;
  private readonly plusMinus: boolean;
  private readonly allowedSettings: readonly number[];
  private readonly plainRows: PlainRowReader;

  constructor(
    private readonly layout: StationLayout,
    private readonly problems: ProblemList,
  ) {
    this.roundColumn = layout.columnNames[layout.columnOfField[ROUND]];
    this.plusMinus = layout.outcomes === '±1';
    this.allowedSettings = ALLOWED_SETTINGS[layout.station];
    this.plainRows = new PlainRowReader(layout);
  }

  /**
   * Checks one record given as its line's text; returns the decoded row, or null when it has a
   * problem. The common row (every field plain and valid) is read character by character without
   * making a string per field; any other row is split by `splitCsvLine` and checked by `accept`,
   * which names what is wrong, so both paths take exactly the same rows.
   */
  acceptText(line: number, text: string): StationRow | null {
    const plain = this.plainRows;
    if (plain.read(text)) {
      const { round, setting, outcome: written, settingTime, outcomeTime } = plain;
      const outcome = this.plusMinus ? (written === 1 ? 0 : written === -1 ? 1 : NaN) : written;
      if (round >= 0 && round <= LARGEST_ROUND && this.allowedSettings.includes(setting) && (outcome === 0 || outcome === 1)) {
        return this.checkOrder(round, line) ? { round, setting, outcome, settingTime, outcomeTime } : null;
      }
    }
    const split = splitCsvLine(text);
    if ('error' in split) {
      this.problems.add(line, null, text, `the row's quoting is broken: ${split.error}`);
      return null;
    }
    return this.accept(line, split.fields);
  }

  /** The last readable round index and its line. */
  get last(): RoundMark | null {
    return this.first === null ? null : { round: this.previousRound, line: this.previousLine };
  }

  /** Whether setting `setting` is one this station chooses. */
  allowsSetting(setting: number): boolean {
    return this.allowedSettings.includes(setting);
  }

  /**
   * Takes a row a fast path has read and found in range (round index 0 … 2^53 − 1, setting allowed,
   * outcome 0 or 1): checks its order, as `acceptText` would. Returns whether the row is taken; a
   * repeat or a step back is recorded as a problem.
   */
  acceptInRange(line: number, round: number): boolean {
    return this.checkOrder(round, line);
  }

  /** Checks one record given as its fields; returns the decoded row, or null when it has a problem. */
  accept(line: number, fields: readonly string[]): StationRow | null {
    const layout = this.layout;
    if (fields.length !== layout.fieldCount) {
      this.problems.add(line, null, null, `the row has ${fields.length} fields, the header has ${layout.fieldCount}`);
      return null;
    }
    const at = layout.columnOfField;
    const round = parseIntegerField(fields[at[ROUND]]);
    const setting = parseIntegerField(fields[at[SETTING]]);
    const written = parseIntegerField(fields[at[OUTCOME]]);
    const outcome = this.plusMinus ? (written === 1 ? 0 : written === -1 ? 1 : NaN) : written;
    const settingTime = layout.hasTimes ? parsePicosecondTime(fields[at[SETTING_TIME]]) : null;
    const outcomeTime = layout.hasTimes ? parsePicosecondTime(fields[at[OUTCOME_TIME]]) : null;
    const roundReadable = round >= 0 && round <= LARGEST_ROUND;
    const valid =
      roundReadable && this.allowedSettings.includes(setting) && (outcome === 0 || outcome === 1) && (!layout.hasTimes || (settingTime !== null && outcomeTime !== null));
    if (!valid) {
      this.describeProblems(line, fields, { round, setting, written, settingTime, outcomeTime });
    }
    const ordered = roundReadable && this.checkOrder(round, line);
    return valid && ordered ? { round, setting, outcome, settingTime, outcomeTime } : null;
  }

  /** One problem per bad field, in the order of `STATION_FIELDS`. */
  private describeProblems(
    line: number,
    fields: readonly string[],
    read: Record<'round' | 'setting' | 'written', number> & Record<'settingTime' | 'outcomeTime', bigint | null>,
  ): void {
    const station = this.layout.station;
    const messages: Record<StationField, string | null> = {
      round: Number.isNaN(read.round)
        ? `the ${stationFieldMeaning(station, 'round')} is not an integer`
        : read.round >= 0 && read.round <= LARGEST_ROUND
          ? null
          : `the round index must be a whole number from 0 to ${LARGEST_ROUND}`,
      setting: this.integerProblem('setting', read.setting, this.allowedSettings.includes(read.setting), SETTING_RULE[this.layout.station]),
      outcome: this.integerProblem(
        'outcome',
        read.written,
        this.plusMinus ? read.written === 1 || read.written === -1 : read.written === 0 || read.written === 1,
        this.plusMinus ? 'must be +1 or -1' : 'must be 0 or 1',
      ),
      settingTime: this.layout.hasTimes && read.settingTime === null ? timeProblem(station, 'settingTime') : null,
      outcomeTime: this.layout.hasTimes && read.outcomeTime === null ? timeProblem(station, 'outcomeTime') : null,
    };
    for (const [index, field] of STATION_FIELDS.entries()) {
      const message = messages[field];
      if (message !== null) {
        const column = this.layout.columnOfField[index];
        this.problems.add(line, this.layout.columnNames[column], fields[column], message);
      }
    }
  }

  private integerProblem(field: StationField, value: number, allowed: boolean, rule: string): string | null {
    const meaning = stationFieldMeaning(this.layout.station, field);
    return Number.isNaN(value) ? `the ${meaning} is not an integer` : allowed ? null : `the ${meaning} ${rule}`;
  }

  /** Checks a readable round index against the one before; a repeat or a step back is a problem. */
  private checkOrder(round: number, line: number): boolean {
    const previousRound = this.previousRound;
    const previousLine = this.previousLine;
    this.previousRound = round;
    this.previousLine = line;
    if (this.first === null) {
      this.first = { round, line };
      return true;
    }
    if (round > previousRound) {
      this.gaps += round - previousRound - 1;
      return true;
    }
    return recordOrder({ round: previousRound, line: previousLine }, { round, line }, this.problems, this.roundColumn, (gap) => (this.gaps += gap));
  }
}

function timeProblem(station: Station, field: StationField): string {
  return `the ${stationFieldMeaning(station, field)} must be whole picoseconds since the station's epoch, digits only, at most 9223372036854775807`;
}
