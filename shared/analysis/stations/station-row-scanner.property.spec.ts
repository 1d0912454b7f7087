import fc from 'fast-check';
import { OutcomeEncoding } from '../log/column-mapping';
import { Station, STATION_COLUMNS } from './station-columns';
import { StationLogReader } from './station-log-reader';
import { asyncSlices } from './testing/async-slices';

// Most rows of a station log in its own column order are read by the byte scanner's fast path; rows
// of a log with its columns in another order all go field by field through the record checker. The
// same records written both ways, good and bad fields mixed, cut into pieces anywhere, must give the
// same rows and the same problems: the fast path takes no row the checker would refuse, with no
// other value.

/** Field texts: most valid, some near misses of each rule. */
const integerText = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom('0', '1') },
  { weight: 1, arbitrary: fc.constantFrom('2', '-1', '+1', '01', '+0', '-0', '', ' 1', '1 ', 'x', '1.0', '"1"', '11') },
);
const roundText = fc.oneof(
  { weight: 8, arbitrary: fc.integer({ min: 0, max: 40 }).map(String) },
  { weight: 1, arbitrary: fc.constantFrom('-3', '+4', '007', '9007199254740991', '9007199254740992', '123456789012345', '1234567890123456', '', 'r') },
);
const timeText = fc.oneof(
  { weight: 6, arbitrary: fc.bigInt({ min: 0n, max: 10n ** 18n - 1n }).map(String) },
  {
    weight: 1,
    arbitrary: fc.constantFrom('9223372036854775807', '9223372036854775808', '0009', '-5', '+5', '1e3', '', '12345678901234567890', '1 2'),
  },
);
const record = fc.record({ round: roundText, setting: integerText, outcome: integerText, settingTime: timeText, outcomeTime: timeText });
const ending = fc.constantFrom('\n', '\r\n');

function logText(station: Station, records: readonly Record<string, string>[], endings: readonly string[], times: boolean, order: readonly string[]): string {
  const fields = ['round', 'setting', 'outcome', ...(times ? ['settingTime', 'outcomeTime'] : [])];
  const columns = order.filter((field) => fields.includes(field));
  const names = STATION_COLUMNS[station] as Record<string, string>;
  const header = columns.map((field) => names[field]).join(',');
  return header + '\n' + records.map((r, i) => columns.map((field) => r[field]).join(',') + endings[i % endings.length]).join('');
}

async function read(text: string, station: Station, outcomes: OutcomeEncoding, piece: number) {
  const reader = new StationLogReader(station, outcomes);
  const rows = [];
  for await (const batch of reader.rows(asyncSlices(new TextEncoder().encode(text), piece))) rows.push(...batch.rows());
  const { layout: _layout, ...summary } = reader.summary();
  return { rows, summary };
}

describe('the byte scanner and the field-by-field reader', () => {
  it('read the same rows and problems from the same records', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom<Station>('A', 'B'),
        fc.constantFrom<OutcomeEncoding>('0/1', '±1'),
        fc.boolean(),
        fc.array(record, { minLength: 1, maxLength: 30 }),
        fc.array(ending, { minLength: 1, maxLength: 3 }),
        fc.integer({ min: 1, max: 64 }),
        async (station, outcomes, times, records, endings, piece) => {
          const own = logText(station, records, endings, times, ['round', 'setting', 'outcome', 'settingTime', 'outcomeTime']);
          const shuffled = logText(station, records, endings, times, ['outcome', 'settingTime', 'round', 'outcomeTime', 'setting']);
          const fast = await read(own, station, outcomes, piece);
          const fieldByField = await read(shuffled, station, outcomes, 1 << 20);
          expect(fast.rows).toEqual(fieldByField.rows);
          expect(fast.summary).toEqual(fieldByField.summary);
        },
      ),
    );
  });
});
