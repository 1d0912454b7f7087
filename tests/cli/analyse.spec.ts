import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { AnalysisResult } from '@shared/analysis/result';
import { fixture, runAnalyse, SEED } from './run-analyse';

const CONTRACT_KEYS = [
  'engineVersion',
  'input',
  'profile',
  'seed',
  'selection',
  'missingRounds',
  'counts',
  'chsh',
  'qber',
  'key',
  'security',
  'checks',
  'blocks',
  'verdict',
  'reasons',
  'errors',
  'errorCount',
  'fingerprint',
];

/** The result the command printed on stdout. */
const printed = (stdout: string) => JSON.parse(stdout) as AnalysisResult;

describe('analyse command', () => {
  let scratch: string;
  beforeAll(() => {
    scratch = mkdtempSync(path.join(tmpdir(), 'bellkeep-cli-'));
  });
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it('accepts the steady run under the observed criterion with exit 0 and every contract key', () => {
    const run = runAnalyse(fixture('accepted-run.csv'), '--seed', SEED, '--profile', fixture('observed-profile.json'));
    expect(run.status).toBe(0);
    const result = printed(run.stdout);
    expect(Object.keys(result).sort()).toEqual([...CONTRACT_KEYS].sort());
    expect(result.verdict).toBe('ACCEPT');
    expect(result.seed).toBe(SEED);
    expect(Object.keys(result.input).sort()).toEqual(expect.arrayContaining(['sha256', 'bytes', 'rounds']));
    expect(Object.keys(result.chsh!)).toEqual(expect.arrayContaining(['rounds', 'wins', 'winFraction', 'winFractionLower', 'S', 'correlators', 'pValue', 'log10PValue', 'pairs']));
    expect(result.chsh!.pairs).toHaveLength(4);
    expect(Object.keys(result.qber!)).toEqual(expect.arrayContaining(['rounds', 'errors', 'rate', 'rateUpper', 'untestedRateUpper']));
    expect(Object.keys(result.key!)).toEqual(expect.arrayContaining(['rawBits', 'asymptoticRate', 'minEntropyPerRound', 'finiteKeyBits']));
    expect(result.selection).toEqual({ mode: 'fixed-fraction', testRounds: 12_000, generationRounds: 12_000 });
    // The file's SHA-256 as coreutils' sha256sum computes it.
    expect(result.input.sha256).toBe(execFileSync('sha256sum', [fixture('accepted-run.csv')], { encoding: 'utf8' }).split(' ')[0]);
    expect(run.stderr).toContain('verdict: ACCEPT');
  });

  it('aborts the low-CHSH run with exit 1 and says why', () => {
    const run = runAnalyse(fixture('aborted-low-chsh.csv'), '--seed', SEED);
    expect(run.status).toBe(1);
    const result = printed(run.stdout);
    expect(result.verdict).toBe('ABORT');
    expect(result.reasons.join(' ')).toContain('CHSH win fraction');
  });

  it('aborts the run with a biased setting generator on the uniformity check', () => {
    const run = runAnalyse(fixture('biased-setting-rng.csv'), '--seed', SEED);
    expect(run.status).toBe(1);
    const result = printed(run.stdout);
    expect(result.checks.find((check) => check.id === 'setting-uniformity-x')!.status).toBe('fail');
  });

  it('refuses the steady run under the certified default: 24 000 rounds are too few for its bounds', () => {
    const run = runAnalyse(fixture('accepted-run.csv'), '--seed', SEED);
    expect(run.status).toBe(1);
    expect(printed(run.stdout).reasons.join(' ')).toContain('lower bound of the CHSH win fraction');
  });

  it('aborts the drifting run under the collective model: its key figure assumes identical rounds', () => {
    const run = runAnalyse(fixture('drifting-run.csv'), '--seed', SEED, '--profile', fixture('observed-profile.json'));
    const result = printed(run.stdout);
    expect(run.status).toBe(1);
    expect(result.checks.find((check) => check.id === 'stationarity-chsh')!.status).toBe('fail');
    expect(result.reasons).toContainEqual(expect.stringMatching(/^The test “Steady CHSH win fraction” failed: The CHSH win fraction is not steady/));
    expect(result.blocks).toHaveLength(10);
  });

  it('reads the Mill Lane export (BOM, CRLF, ±1 outcomes, own names, lab marking) through a mapping', () => {
    const run = runAnalyse(fixture('mill-lane-export.csv'), '--mapping', fixture('mill-lane-mapping.json'), '--profile', fixture('from-log-profile.json'));
    expect(run.status).toBe(0);
    const result = printed(run.stdout);
    expect(result.seed).toBeNull();
    expect(result.selection!.mode).toBe('from-log');
    expect(result.verdict).toBe('ACCEPT');
    // A few trigger indices are missing, within the default tolerance of 0.1 %; with the log's own
    // marks every one of them counts as a lost test round.
    const missingRounds = result.missingRounds!;
    expect(missingRounds.missing).toBeGreaterThan(0);
    expect(missingRounds.missing).toBeLessThanOrEqual(missingRounds.tolerated);
    expect(missingRounds.drawnForTesting).toBe(missingRounds.missing);
    expect(result.chsh!.missingTestRounds).toBe(missingRounds.missing);
    expect(result.checks[0]).toMatchObject({ id: 'log-integrity', status: 'pass' });
  });

  it('lists the problems of a malformed log with line, column and value, exit 3', () => {
    const run = runAnalyse(fixture('malformed-rows.csv'), '--seed', SEED);
    expect(run.status).toBe(3);
    const result = printed(run.stdout);
    expect(result.verdict).toBe('INVALID');
    expect(result.errorCount).toBe(6);
    expect(result.errors[1]).toEqual({ line: 11, column: 'y', value: 'two', message: 'the station B setting is not an integer' });
    expect(result.errors.map((e) => e.line)).toEqual([6, 11, 16, 21, 26, 31]);
  });

  it.each([
    ['empty.csv', 'empty'],
    ['missing-column.csv', 'no column "y"'],
    ['header-only.csv', 'no rounds'],
    ['binary.bin', 'binary'],
  ])('gives %s a clear message, exit 3', (name, words) => {
    const run = runAnalyse(fixture(name), '--seed', SEED);
    expect(run.status).toBe(3);
    expect(printed(run.stdout).errors[0].message).toContain(words);
  });

  it('gives the same result for the gzip file, one thread and two threads', () => {
    const gzipped = path.join(scratch, 'drifting-run.log');
    writeFileSync(gzipped, gzipSync(readFileSync(fixture('drifting-run.csv'))));
    const plain = printed(runAnalyse(fixture('drifting-run.csv'), '--seed', SEED, '--threads', '1').stdout);
    const threaded = printed(runAnalyse(fixture('drifting-run.csv'), '--seed', SEED, '--threads', '2').stdout);
    const fromGzip = printed(runAnalyse(gzipped, '--seed', SEED).stdout);
    expect(threaded).toEqual(plain);
    expect(fromGzip.input.compression).toBe('gzip');
    const withoutInput = (result: AnalysisResult) => ({ ...result, input: undefined, fingerprint: undefined });
    expect(withoutInput(fromGzip)).toEqual(withoutInput(plain));
  });

  it('draws a seed when none is given, and another seed selects other rounds', () => {
    const drawn = printed(runAnalyse(fixture('accepted-run.csv')).stdout);
    expect(drawn.seed).toMatch(/^[0-9a-f]{64}$/);
    const fixed = printed(runAnalyse(fixture('accepted-run.csv'), '--seed', SEED).stdout);
    expect(drawn.counts).not.toEqual(fixed.counts);
  });

  it.each([
    [['--seed', SEED], 'the round log is missing'],
    [[fixture('accepted-run.csv'), '--seed', 'abc'], '64 hexadecimal digits'],
    [[fixture('accepted-run.csv'), '--colour', 'red'], 'unknown option'],
    [[path.join('no', 'such', 'log.csv')], 'cannot read'],
  ])('exits 2 on a usage or I/O error: %j', (args, words) => {
    const run = runAnalyse(...args);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain(words);
  });

  it('exits 2 naming the field of a bad profile', () => {
    const profile = path.join(scratch, 'bad-profile.json');
    writeFileSync(profile, JSON.stringify({ testSelection: { mode: 'bernoulli', probability: 2 } }));
    const run = runAnalyse(fixture('accepted-run.csv'), '--profile', profile);
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('testSelection.probability');
  });
});
