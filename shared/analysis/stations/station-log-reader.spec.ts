import { OutcomeEncoding } from '../log/column-mapping';
import { Station } from './station-columns';
import { STATION_BATCH_ROWS, StationLogReader, StationLogSummary } from './station-log-reader';
import { StationRow } from './station-row';
import { asyncSlices } from './testing/async-slices';

/** Reads a station log given as text, cut into pieces of `size` bytes. */
async function read(
  text: string | Uint8Array,
  station: Station,
  options: { size?: number; outcomes?: OutcomeEncoding } = {},
): Promise<{ rows: StationRow[]; summary: StationLogSummary }> {
  const bytes = typeof text === 'string' ? new TextEncoder().encode(text) : text;
  const reader = new StationLogReader(station, options.outcomes);
  const rows: StationRow[] = [];
  for await (const batch of reader.rows(asyncSlices(bytes, options.size ?? 1 << 20))) {
    expect(batch.length).toBeGreaterThan(0);
    rows.push(...batch.rows());
  }
  return { rows, summary: reader.summary() };
}

const row = (round: number, setting: number, outcome: number, settingTime: bigint | null = null, outcomeTime: bigint | null = null): StationRow => ({
  round,
  setting,
  outcome,
  settingTime,
  outcomeTime,
});

describe('StationLogReader', () => {
  it("reads station A's record with times, exactly beyond 2^53 ps", async () => {
    const text = 'round,x,a,t_setting,t_outcome\n0,1,0,86400000000050101,86400000001650992\n1,0,1,9223372036854775807,0\n3,1,1,5,6\n';
    const { rows, summary } = await read(text, 'A');
    expect(rows).toEqual([row(0, 1, 0, 86_400_000_000_050_101n, 86_400_000_001_650_992n), row(1, 0, 1, 2n ** 63n - 1n, 0n), row(3, 1, 1, 5n, 6n)]);
    expect(summary).toMatchObject({ station: 'A', records: 3, rows: 3, firstRound: 0, lastRound: 3, gaps: 1, problemCount: 0 });
    expect(summary.layout?.hasTimes).toBe(true);
  });

  it("reads station B's record without times: y may be 2, ±1 outcomes decoded, any column order, extra columns, BOM, CRLF, quoting", async () => {
    const text = '\ufeffnote,b,round,y\r\n"a, b",+1,7,2\r\n,-1,"8",0\r\n\r\nx,"+1",9,1';
    const { rows, summary } = await read(text, 'B', { outcomes: '±1' });
    expect(rows).toEqual([row(7, 2, 0), row(8, 0, 1), row(9, 1, 0)]);
    expect(summary).toMatchObject({ records: 3, rows: 3, gaps: 0, problemCount: 0 });
    expect(summary.layout?.hasTimes).toBe(false);
  });

  it('gives the same rows and problems however the bytes are cut, a piece at a time down to one byte', async () => {
    const text =
      'round,y,b,t_setting,t_outcome\r\n' +
      Array.from({ length: 40 }, (_, i) => `${i * 2},${i % 3},${i % 2},${1000 + i},${90071992547409910n + BigInt(i)}`).join('\r\n') +
      '\r\n5,9,1,1,1\n';
    const whole = await read(text, 'B');
    expect(whole.rows).toHaveLength(40);
    expect(whole.summary.problemCount).toBe(2);
    for (const size of [1, 2, 3, 7, 64]) {
      expect(await read(text, 'B', { size })).toEqual(whole);
    }
  });

  it('names each bad field with its line, column and value, with the joined log words, and hands on no bad row', async () => {
    const text = [
      'round,x,a,t_setting,t_outcome',
      '0,1,0,10,20', // line 2: fine
      '1,2,0,10,20', // 3: A's setting 2
      '2,1,-1,10,20', // 4: outcome -1 without the ±1 mapping
      '3,1,0,1.5,20', // 5: a decimal time
      '4,1,0,10,+20', // 6: a signed time
      '5,1,0,10,9223372036854775808', // 7: past 2^63 − 1
      '6,1,0,10', // 8: a missing field
      '7,one,0,10,20', // 9: not an integer
      '"8,1,0,10,20', // 10: broken quoting
      '9,1,0,10,20', // 11: fine
    ].join('\n');
    const { rows, summary } = await read(text, 'A');
    expect(rows.map((r) => r.round)).toEqual([0, 9]);
    expect(summary.problems).toEqual([
      { line: 3, column: 'x', value: '2', message: 'the station A setting must be 0 or 1' },
      { line: 4, column: 'a', value: '-1', message: 'the station A outcome must be 0 or 1' },
      {
        line: 5,
        column: 't_setting',
        value: '1.5',
        message: "the station A setting time must be whole picoseconds since the station's epoch, digits only, at most 9223372036854775807",
      },
      {
        line: 6,
        column: 't_outcome',
        value: '+20',
        message: "the station A outcome time must be whole picoseconds since the station's epoch, digits only, at most 9223372036854775807",
      },
      {
        line: 7,
        column: 't_outcome',
        value: '9223372036854775808',
        message: "the station A outcome time must be whole picoseconds since the station's epoch, digits only, at most 9223372036854775807",
      },
      { line: 8, column: null, value: null, message: 'the row has 4 fields, the header has 5' },
      { line: 9, column: 'x', value: 'one', message: 'the station A setting is not an integer' },
      { line: 10, column: null, value: '"8,1,0,10,20', message: "the row's quoting is broken: quoted field 1 is not closed on this line" },
    ]);
    expect(summary.problemCount).toBe(8);
  });

  it('names a repeated round index and one that goes back', async () => {
    const text = 'round,y,b\n5,0,0\n6,1,1\n6,2,0\n4,1,0\n7,0,1\n';
    const { rows, summary } = await read(text, 'B');
    expect(rows.map((r) => r.round)).toEqual([5, 6, 7]);
    expect(summary.problems).toEqual([
      { line: 4, column: 'round', value: '6', message: 'round index 6 repeats (also on line 3)' },
      { line: 5, column: 'round', value: '4', message: 'round index 4 goes back (line 4 has 6)' },
    ]);
  });

  it('refuses a line longer than 1 MiB as no round record, and reads on after it', async () => {
    const text = `round,x,a\n0,0,0\n1,${'1'.repeat(1 << 20)}\n2,1,1\n`;
    for (const size of [1 << 20, 4096]) {
      const { rows, summary } = await read(text, 'A', { size });
      expect(rows.map((r) => r.round)).toEqual([0, 2]);
      expect(summary.problems).toEqual([{ line: 3, column: null, value: `1,${'1'.repeat(38)}…`, message: 'the line is longer than 1048576 bytes: not a round record' }]);
    }
  });

  it('keeps the CR of a last line without a line break, as the joined log does', async () => {
    const { summary } = await read('round,x,a\n0,1,1\r', 'A');
    expect(summary.problems).toEqual([{ line: 2, column: 'a', value: '1\r', message: 'the station A outcome is not an integer' }]);
  });

  it.each([
    ['an empty file', '', 'A', { line: 1, column: null, value: null, message: 'the file is empty: a round log needs a header line and at least one round' }],
    ['a header alone', 'round,x,a\n', 'A', { line: 2, column: null, value: null, message: 'the log has a header but no rounds' }],
    [
      "station B's log read as station A's",
      'round,y,b\n0,1,1\n',
      'A',
      { line: 1, column: 'x', value: null, message: 'the header has no column "x" for the station A setting; it has: round, y, b (it looks like station B\'s log)' },
    ],
    [
      'one time column without the other',
      'round,y,b,t_setting\n0,1,1,5\n',
      'B',
      { line: 1, column: 't_setting', value: null, message: 'the header has column "t_setting" but no "t_outcome": a station log gives both times or neither' },
    ],
    ['a column named twice', 'round,y,b,y\n0,1,1,1\n', 'B', { line: 1, column: 'y', value: null, message: 'the header names column "y" (station B setting) 2 times' }],
    [
      'semicolons for commas',
      'round;x;a\n0;1;1\n',
      'A',
      { line: 1, column: null, value: null, message: 'the header line is one column: its fields are separated by semicolons (;), and a round log separates them with commas' },
    ],
  ] as const)('refuses %s with one problem', async (_, text, station, problem) => {
    const { rows, summary } = await read(text, station);
    expect(rows).toEqual([]);
    expect(summary.problems).toEqual([problem]);
  });

  it('refuses a binary file', async () => {
    const { summary } = await read(Uint8Array.from([0x72, 0x6f, 0x00, 0x75, 0x6e, 0x64]), 'A');
    expect(summary.problems).toEqual([{ line: 1, column: null, value: null, message: 'the file looks binary (a zero byte at offset 2), not a CSV round log' }]);
  });

  it('hands on rows a batch at a time, never a whole large log at once', async () => {
    const text = 'round,x,a\n' + Array.from({ length: 100_000 }, (_, i) => `${i},${i % 2},${(i >> 1) % 2}`).join('\n') + '\n';
    const reader = new StationLogReader('A');
    const sizes: number[] = [];
    for await (const batch of reader.rows(asyncSlices(new TextEncoder().encode(text), 4 << 20))) sizes.push(batch.length);
    const full = Math.floor(100_000 / STATION_BATCH_ROWS);
    expect(sizes).toEqual([...Array<number>(full).fill(STATION_BATCH_ROWS), 100_000 - full * STATION_BATCH_ROWS]);
  });
});
