import { expect } from '@jest/globals';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { Readable } from 'node:stream';
import { gzipSync } from 'node:zlib';
import { analyseLog } from './analyse-log';
import { AnalysisCancelledError, AnalysisRequestError } from './analysis-errors';
import { AnalysisProgress } from './analysis-progress';

const ACCEPTED = path.resolve(__dirname, '../../../fixtures/logs/accepted-run.csv');
const SEED = '3c'.repeat(32);

describe('analyseLog', () => {
  it('reports progress for both passes up to the file size', async () => {
    const seen: AnalysisProgress[] = [];
    await analyseLog({ path: ACCEPTED }, { seed: SEED, onProgress: (progress) => seen.push(progress) });
    const size = readFileSync(ACCEPTED).length;
    expect(seen.filter((p) => p.phase === 'counting').at(-1)).toEqual({ phase: 'counting', bytesRead: size, totalBytes: size });
    expect(seen.filter((p) => p.phase === 'analysing').at(-1)).toEqual({ phase: 'analysing', bytesRead: size, totalBytes: size });
  });

  it('stops with AnalysisCancelledError when its signal is aborted', async () => {
    const controller = new AbortController();
    const running = analyseLog({ path: ACCEPTED }, { seed: SEED, onProgress: () => controller.abort(), signal: controller.signal });
    await expect(running).rejects.toBeInstanceOf(AnalysisCancelledError);
  });

  it('reads a stream source and gives the file result', async () => {
    const bytes = readFileSync(ACCEPTED);
    const fromFile = await analyseLog({ path: ACCEPTED }, { seed: SEED });
    const fromStream = await analyseLog({ open: () => Readable.from([bytes.subarray(0, 1000), bytes.subarray(1000)]) }, { seed: SEED });
    expect(fromStream).toEqual(fromFile);
  });

  it('calls damaged gzip data INVALID with a message', async () => {
    const gzip = gzipSync(readFileSync(ACCEPTED));
    const damaged = Buffer.concat([gzip.subarray(0, 5000), Buffer.alloc(200, 7), gzip.subarray(5200)]);
    const result = await analyseLog({ open: () => Readable.from([damaged]) }, { seed: SEED });
    expect(result.verdict).toBe('INVALID');
    expect(result.errors[0].message).toContain('gzip data is damaged');
  });

  it('names the whole stored file in a damaged gzip result, though the reading stopped at the damage', async () => {
    const damaged = gzipSync(readFileSync(ACCEPTED));
    // The first deflate block header (after the 10-byte gzip header) made an invalid block type:
    // the decoder fails at once. Small pieces, so almost all of the file comes after that.
    damaged[10] |= 0b110;
    const pieces = function* () {
      for (let start = 0; start < damaged.length; start += 100) yield damaged.subarray(start, start + 100);
    };
    const result = await analyseLog({ open: () => Readable.from(pieces()) }, { seed: SEED });
    expect(result.errors[0].message).toContain('gzip data is damaged');
    expect(result.input).toMatchObject({ bytes: damaged.length, sha256: createHash('sha256').update(damaged).digest('hex') });
  });

  it('calls gzip data that expands more than 100-fold a decompression bomb, having decoded little of it', async () => {
    const bomb = gzipSync(Buffer.alloc(256 * 1024 * 1024, '\n'), { level: 9 });
    const result = await analyseLog({ open: () => Readable.from([bomb]) }, { seed: SEED });
    expect(result.verdict).toBe('INVALID');
    expect(result.errors[0]).toMatchObject({ line: 1, column: null });
    const [, taken, decoded] = /expands more than 100-fold \((\d+) bytes to (\d+) so far\): a decompression bomb/.exec(result.errors[0].message)!.map(Number);
    expect(decoded).toBeGreaterThan(100 * taken);
    expect(decoded).toBeLessThan(4 * 1024 * 1024);
    expect(result.input).toMatchObject({ bytes: bomb.length, compression: 'gzip' });
  });

  it('calls a line over 1 MiB no round record, whether it is read whole, in pieces or from gzip', async () => {
    // Hex of a hash chain: a long field that gzip cannot squeeze like a decompression bomb.
    const junk = Array.from({ length: 24_000 }, (_, i) => createHash('sha256').update(String(i)).digest('hex')).join('');
    const lines = readFileSync(ACCEPTED, 'utf8').split('\n');
    lines[5] = `5,${junk},1,0,1`;
    const log = Buffer.from(lines.join('\n'));
    const folder = mkdtempSync(path.join(tmpdir(), 'long-line-'));
    const file = path.join(folder, 'log.csv');
    writeFileSync(file, log);
    const pieces = function* () {
      for (let start = 0; start < log.length; start += 64 * 1024) yield log.subarray(start, start + 64 * 1024);
    };
    const gzip = gzipSync(log);
    const results = [
      await analyseLog({ path: file }, { seed: SEED }),
      await analyseLog({ open: () => Readable.from(pieces()) }, { seed: SEED }),
      await analyseLog({ open: () => Readable.from([gzip]) }, { seed: SEED }),
    ];
    rmSync(folder, { recursive: true });
    for (const result of results) {
      expect(result.errors[0]).toEqual({ line: 6, column: null, value: `5,${junk.slice(0, 38)}…`, message: 'the line is longer than 1048576 bytes: not a round record' });
    }
  });

  it('shows a NUL byte past the first 64 KiB as ␀ in its problem: PostgreSQL stores no NUL', async () => {
    const lines = readFileSync(ACCEPTED, 'utf8').split('\n');
    lines[9000] = lines[9000].replace(',', ',\0');
    const log = Buffer.from(lines.join('\n'));
    const result = await analyseLog({ open: () => Readable.from([log]) }, { seed: SEED });
    expect(result.errors[0]).toMatchObject({ line: 9001, column: 'x' });
    expect(result.errors[0].value).toMatch(/^\u2400[01]$/);
    expect(JSON.stringify(result)).not.toContain('\\u0000');
  });

  it('refuses a bad seed, profile or mapping with an AnalysisRequestError naming it', async () => {
    await expect(analyseLog({ path: ACCEPTED }, { seed: 'xyz' })).rejects.toThrow(/64 hexadecimal/);
    await expect(analyseLog({ path: ACCEPTED }, { profile: { driftBlocks: 1 } })).rejects.toThrow(/driftBlocks/);
    await expect(analyseLog({ path: ACCEPTED }, { mapping: { outcomes: 'yes/no' } })).rejects.toBeInstanceOf(AnalysisRequestError);
  });

  it('certified criterion is stricter than observed', async () => {
    // Same log and seed: the Hoeffding-corrected win fraction is lower, so a tolerance that the
    // observed value meets can fail once corrected.
    const observed = await analyseLog({ path: ACCEPTED }, { seed: SEED, profile: { chshTolerance: 0.02, criterion: 'observed' } });
    const certified = await analyseLog({ path: ACCEPTED }, { seed: SEED, profile: { chshTolerance: 0.02, criterion: 'certified' } });
    expect(observed.verdict).toBe('ACCEPT');
    expect(certified.verdict).toBe('ABORT');
    expect(certified.reasons[0]).toContain('lower bound of the CHSH win fraction');
  });

  it('calls a joined log INVALID under a profile that requires space-like separation, still naming the file; reporting it changes nothing', async () => {
    const reported = await analyseLog({ path: ACCEPTED }, { seed: SEED, profile: { criterion: 'observed' } });
    const required = await analyseLog({ path: ACCEPTED }, { seed: SEED, profile: { criterion: 'observed', spaceLikeSeparation: 'required' } });
    expect(reported.verdict).toBe('ACCEPT');
    expect(reported.checks.map((check) => check.id)).not.toContain('space-like-separation');
    expect(required).toMatchObject({ verdict: 'INVALID', chsh: null, checks: [], errors: [], errorCount: 0, input: reported.input });
    expect(required.reasons).toEqual([
      "The profile requires space-like separation, which only two station logs with their time columns (t_setting, t_outcome) and the setup's distance between the stations can show: one joined log cannot be judged under it.",
    ]);
  });
});
