import { LATEST_PICOSECOND_TIME } from './picosecond-time';
import { STATION_FIELDS } from './station-columns';
import { StationLayout } from './station-header';

const ROUND = STATION_FIELDS.indexOf('round');
const SETTING = STATION_FIELDS.indexOf('setting');
const OUTCOME = STATION_FIELDS.indexOf('outcome');
const SETTING_TIME = STATION_FIELDS.indexOf('settingTime');

const COMMA = 44;
const QUOTE = 34;
const PLUS = 43;
const MINUS = 45;
const DIGIT_0 = 48;
const DIGIT_9 = 57;
/** Digits a double holds exactly whatever they are (10^15 < 2^53). */
const EXACT_DIGITS = 15;
/** Digits of the largest time, 2^63 − 1. */
const TIME_DIGITS = 19;

/**
 * The station reader's fast path: reads a row whose fields are all plain, character by character,
 * without making a string per field (most rows of a log). Plain means the header's number of fields;
 * where an integer belongs, an optional sign and 1 to 15 digits; where a time belongs, 1 to 19 digits
 * up to 2^63 − 1; anything but a quote in other columns. `read` returns false for any other row,
 * which the record checker then splits and checks field by field, naming its problems. Values are
 * as written (outcomes not decoded, settings not checked).
 */
export class PlainRowReader {
  /** The last row's fields (valid only after `read` returned true). */
  round = NaN;
  setting = NaN;
  outcome = NaN;
  settingTime: bigint | null = null;
  outcomeTime: bigint | null = null;
  /** For each column, the field it holds (an index of `STATION_FIELDS`), or −1. */
  private readonly fieldOfColumn: Int8Array;
  private readonly integers = new Float64Array(3);
  private readonly times: (bigint | null)[] = [null, null];

  constructor(layout: StationLayout) {
    this.fieldOfColumn = new Int8Array(layout.fieldCount).fill(-1);
    layout.columnOfField.forEach((column, field) => {
      if (column >= 0) this.fieldOfColumn[column] = field;
    });
  }

  /** Reads one line's text; returns whether it is a plain row (its fields then in this reader). */
  read(text: string): boolean {
    const fieldOfColumn = this.fieldOfColumn;
    const integers = this.integers;
    const times = this.times;
    const length = text.length;
    times[0] = null;
    times[1] = null;
    let i = 0;
    for (let column = 0; column < fieldOfColumn.length; column++) {
      if (column > 0) {
        if (text.charCodeAt(i) !== COMMA) return false;
        i++;
      }
      const field = fieldOfColumn[column];
      const start = i;
      if (field < 0) {
        for (let c = text.charCodeAt(i); i < length && c !== COMMA; c = text.charCodeAt(++i)) {
          if (c === QUOTE) return false;
        }
        continue;
      }
      const timed = field >= SETTING_TIME;
      let c = text.charCodeAt(i);
      const negative = c === MINUS;
      if (!timed && (negative || c === PLUS)) c = text.charCodeAt(++i);
      const firstDigit = i;
      let value = 0;
      while (c >= DIGIT_0 && c <= DIGIT_9) {
        value = value * 10 + (c - DIGIT_0);
        c = text.charCodeAt(++i);
      }
      const digits = i - firstDigit;
      if (digits === 0 || (i < length && c !== COMMA) || digits > (timed ? TIME_DIGITS : EXACT_DIGITS)) return false;
      if (!timed) {
        integers[field] = negative ? -value : value;
        continue;
      }
      const time = digits <= EXACT_DIGITS ? BigInt(value) : BigInt(text.slice(start, i));
      if (time > LATEST_PICOSECOND_TIME) return false;
      times[field - SETTING_TIME] = time;
    }
    if (i !== length) return false;
    this.round = integers[ROUND];
    this.setting = integers[SETTING];
    this.outcome = integers[OUTCOME];
    this.settingTime = times[0];
    this.outcomeTime = times[1];
    return true;
  }
}
