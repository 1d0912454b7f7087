/** The fields of one CSV line, or why its quoting is broken. */
export type CsvLineSplit = { fields: string[] } | { error: string };

const QUOTE = '"';
const COMMA = ',';

/**
 * Splits one line (no line break) into fields by the CSV quoting rules of RFC 4180: a field may be
 * wrapped in double quotes, a doubled quote inside stands for one, and a closing quote must be
 * followed by a comma or the end of the line. A quote inside an unquoted field, or a quoted field
 * left open at the end of the line, is an error (round logs never need line breaks inside fields).
 */
export function splitCsvLine(line: string): CsvLineSplit {
  const fields: string[] = [];
  let i = 0;
  for (;;) {
    if (line[i] === QUOTE) {
      let value = '';
      i++;
      for (;;) {
        const close = line.indexOf(QUOTE, i);
        if (close < 0) {
          return { error: `quoted field ${fields.length + 1} is not closed on this line` };
        }
        value += line.slice(i, close);
        if (line[close + 1] === QUOTE) {
          value += QUOTE;
          i = close + 2;
          continue;
        }
        i = close + 1;
        break;
      }
      fields.push(value);
      if (i === line.length) {
        return { fields };
      }
      if (line[i] !== COMMA) {
        return { error: `quoted field ${fields.length} is followed by "${line[i]}" instead of a comma` };
      }
      i++;
      continue;
    }
    const comma = line.indexOf(COMMA, i);
    const value = comma < 0 ? line.slice(i) : line.slice(i, comma);
    if (value.includes(QUOTE)) {
      return { error: `field ${fields.length + 1} has a quote inside an unquoted value` };
    }
    fields.push(value);
    if (comma < 0) {
      return { fields };
    }
    i = comma + 1;
  }
}
