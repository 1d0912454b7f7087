import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { StationRow } from '../station-row';
import { readStationLog, StationLogReading } from './station-log-file';

const TEXT = 'round,x,a,t_setting,t_outcome\n' + Array.from({ length: 3000 }, (_, i) => `${i},${i % 2},${(i >> 1) % 2},${1000 * i},${1000 * i + 7}`).join('\n') + '\n';

async function rowsOf(reading: StationLogReading): Promise<StationRow[]> {
  const rows: StationRow[] = [];
  for await (const batch of reading.rows) rows.push(...batch.rows());
  return rows;
}

describe('readStationLog', () => {
  let scratch: string;
  beforeAll(() => {
    scratch = mkdtempSync(path.join(tmpdir(), 'bellkeep-stations-'));
  });
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it('reads a gzip log (told by its magic bytes, whatever its name) as its plain text', async () => {
    const plainFile = path.join(scratch, 'north-hall.csv');
    const gzipFile = path.join(scratch, 'north-hall.csv.bin');
    writeFileSync(plainFile, TEXT);
    writeFileSync(gzipFile, gzipSync(TEXT));
    const plain = readStationLog({ path: plainFile }, 'A');
    const gzip = readStationLog({ path: gzipFile }, 'A');
    expect(gzip.compression()).toBeNull();
    const rows = await rowsOf(gzip);
    expect(rows).toEqual(await rowsOf(plain));
    expect(rows).toHaveLength(3000);
    expect([plain.compression(), gzip.compression()]).toEqual(['none', 'gzip']);
    expect(gzip.summary()).toMatchObject({ records: 3000, rows: 3000, problemCount: 0 });
  });

  it('turns damaged gzip data into a problem of the log after the rows read before it', async () => {
    const whole = gzipSync(TEXT);
    const damaged = Buffer.concat([whole.subarray(0, 2000), Buffer.alloc(64, 0x55)]);
    const reading = readStationLog({ open: () => Readable.from([damaged]) }, 'A');
    const rows = await rowsOf(reading);
    const summary = reading.summary();
    expect(summary.problemCount).toBe(1);
    expect(summary.problems[0]).toMatchObject({ column: null, value: null });
    expect(summary.problems[0].message).toMatch(/^the gzip data is damaged \(/);
    expect(summary.problems[0].line).toBe(summary.records + 2);
    expect(rows.length).toBe(summary.rows);
  });
});
