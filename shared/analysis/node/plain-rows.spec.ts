import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

import { analyseLog } from './analyse-log';

// The row kernel reads the plain layout `round,x,y,a,b` (0/1 outcomes, LF line ends) eight bytes at
// a time and leaves every other row to its general loop. Each case below puts one unusual row, or
// round indices of another length, into a plain log of 600 rows; the fast reader must give exactly
// csv-parse's result (the reference reader), whether the row is valid or a problem to report.

/** Row i of a plain log whose first round index is `first`: settings and outcomes cycling through every cell. */
const plainRow = (i: number, first: number) => `${first + i},${i % 2},${i % 3},${(i >> 1) % 2},${(i >> 2) % 2}`;

const CASES: [string, number, string | null][] = [
  // name, first round index, the text of row 300 (null: the plain row)
  ['one- to three-digit round indices', 0, null],
  ['indices crossing from 7 to 8 digits', 9_999_700, null],
  ['indices crossing from 8 to 9 digits', 99_999_700, null],
  ['12-digit indices', 123_456_789_000, null],
  ['station B setting 3', 0, '300,1,3,0,1'],
  ['station A setting 2', 0, '300,2,1,0,1'],
  ['outcome a 2', 0, '300,1,1,2,1'],
  ['outcome b written -1', 0, '300,1,1,0,-1'],
  ['a quoted outcome', 0, '300,1,1,"0",1'],
  ['a CR LF line end', 0, '300,1,1,0,1\r'],
  ['a round index with leading zeros', 0, '0300,1,1,0,1'],
  ['a round index with a letter', 0, '30a,1,1,0,1'],
  ['a round index with a plus sign', 0, '+300,1,1,0,1'],
  ['an empty round index', 0, ',1,1,0,1'],
  ['a space after the last field', 0, '300,1,1,0,1 '],
  ['a sixth field', 0, '300,1,1,0,1,0'],
  ['a missing field', 0, '300,1,1,0'],
  ['two digits in a setting', 0, '300,10,1,0,1'],
  ['a blank line', 0, ''],
  ['a round index that repeats the one before', 0, '299,1,1,0,1'],
];

describe('the row kernel on the plain layout agrees with csv-parse', () => {
  let scratch: string;
  beforeAll(() => {
    scratch = mkdtempSync(path.join(tmpdir(), 'bellkeep-plain-'));
  });
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it.each(CASES)('%s', async (name, first, odd) => {
    const rows = Array.from({ length: 600 }, (_, i) => (i === 300 && odd !== null ? odd : plainRow(i, first)));
    const file = path.join(scratch, `${name.replace(/\W+/g, '-')}.csv`);
    writeFileSync(file, `round,x,y,a,b\n${rows.join('\n')}\n`);
    const options = { seed: '3c'.repeat(32), profile: { minTestRounds: 1, driftBlocks: 3 } };
    const reference = await analyseLog({ path: file }, { ...options, reader: 'reference' });
    expect(await analyseLog({ path: file }, options)).toEqual(reference);
    if (odd === null) expect(reference.verdict).not.toBe('INVALID');
  });
});
