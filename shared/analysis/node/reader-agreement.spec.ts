import fc from 'fast-check';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { gzipSync } from 'node:zlib';
import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import { LogCensusTaker } from '../log/log-census';
import { AnalysisResult } from '../result';
import { analyseLog } from './analyse-log';
import { StoredCensus } from './census-ranges';

/**
 * One field value: mostly valid, sometimes quoted, sometimes broken in one of the ways logs break.
 * Left out: a stray CR inside a field (both readers reject the value, but csv-parse's line counter
 * counts the CR as a line break and ours, like `grep -n`, does not) and broken quoting (csv-parse
 * stops at it; the fast reader reports the row and reads on).
 */
const fieldText = (valid: fc.Arbitrary<string>, brokenWeight: number) =>
  fc.oneof(
    { weight: 20 * 4, arbitrary: valid },
    { weight: 2 * 4, arbitrary: valid.map((v) => `"${v}"`) },
    { weight: brokenWeight, arbitrary: fc.constantFrom('', 'two', '1.0', ' 1', '+1', '-0', '3', '-1', '99999999999999999999', '0x1') },
  );

const extraColumn = fc.oneof(fc.constantFrom('ok', '', 'north hall'), fc.constantFrom('"a, b"', '"said ""hi"""', '"x"'));

/** A row: a step in the round index (0 or negative now and then), the five fields, an extra column, a line end. */
const row = (brokenWeight: number) =>
  fc.record({
    step: fc.oneof({ weight: 120, arbitrary: fc.integer({ min: 1, max: 2 }) }, { weight: brokenWeight, arbitrary: fc.integer({ min: -2, max: 0 }) }),
    x: fieldText(fc.constantFrom('0', '1'), brokenWeight),
    y: fieldText(fc.constantFrom('0', '1', '2'), brokenWeight),
    a: fieldText(fc.constantFrom('0', '1'), brokenWeight),
    b: fieldText(fc.constantFrom('0', '1'), brokenWeight),
    extra: extraColumn,
    shape: fc.oneof({ weight: 160, arbitrary: fc.constant('whole') }, { weight: brokenWeight, arbitrary: fc.constantFrom('short', 'long', 'space') }, fc.constant('blank')),
    crlf: fc.boolean(),
  });

/** A random log; `brokenWeight` 0 makes every row valid, 4 breaks about one row in eight. */
const randomLog = (brokenWeight: number, maxRows: number) =>
  fc.record({
    bom: fc.boolean(),
    // The plain layout (the row kernel's eight-bytes-at-a-time path) or any order with a note column.
    order: fc.oneof(fc.constant<string[]>(['round', 'x', 'y', 'a', 'b']), fc.shuffledSubarray(['round', 'x', 'y', 'a', 'b', 'note'], { minLength: 6, maxLength: 6 })),
    // Round indices of 1 to 12 digits, across the 8-digit edge of that path.
    firstRound: fc.constantFrom(0, 7, 99_999_950, 999_999_990, 123_456_789_000),
    rows: fc.array(row(brokenWeight), { minLength: 1, maxLength: maxRows }),
    finalNewline: fc.boolean(),
    mode: fc.constantFrom('fixed-fraction', 'bernoulli'),
    outcomes: fc.constantFrom('0/1', '±1'),
    seed: fc.uint8Array({ minLength: 32, maxLength: 32 }).map((bytes) => Buffer.from(bytes).toString('hex')),
    chunk: fc.integer({ min: 1, max: 64 }),
  });

type Log = ReturnType<typeof randomLog> extends fc.Arbitrary<infer T> ? T : never;

function render(generated: Log): Buffer {
  let round = 0;
  const lines = generated.rows.map((r) => {
    round = Math.max(round + r.step, 0);
    const values: Record<string, string> = {
      round: String(generated.firstRound + round),
      x: r.x,
      y: r.y,
      a: outcome(r.a, generated.outcomes),
      b: outcome(r.b, generated.outcomes),
      note: r.extra,
    };
    const fields = generated.order.map((name) => values[name]);
    const text =
      r.shape === 'blank' ? '' : r.shape === 'space' ? ' ' : r.shape === 'short' ? fields.slice(1).join(',') : r.shape === 'long' ? [...fields, '0'].join(',') : fields.join(',');
    return { text, end: r.crlf ? '\r\n' : '\n' };
  });
  const body = lines.map((line, i) => line.text + (i < lines.length - 1 || generated.finalNewline ? line.end : '')).join('');
  return Buffer.from(`${generated.bom ? '\ufeff' : ''}${generated.order.join(',')}\n${body}`);
}

/** An outcome as a log writes it: 0 and 1 as they are, or as +1 (written "1") and −1 with `±1`; anything else unchanged. */
function outcome(value: string, outcomes: string): string {
  if (outcomes === '0/1') return value;
  return value.replace(/^("?)1("?)$/, '$1-1$2').replace(/^("?)0("?)$/, '$11$2');
}

/** The round index of each record (non-blank row) of a generated log. */
function recordRounds(generated: Log): number[] {
  let round = 0;
  const rounds: number[] = [];
  for (const r of generated.rows) {
    round = Math.max(round + r.step, 0);
    if (r.shape !== 'blank') rounds.push(generated.firstRound + round);
  }
  return rounds;
}

/** Whether the records' round indices leave at most as many triggers missing as there are records. */
function coversItsSpan(rounds: number[]): boolean {
  const span = rounds[rounds.length - 1] - rounds[0] + 1;
  return span - rounds.length <= rounds.length;
}

/** The bytes as a stream cut into pieces of `size` bytes, to cut lines anywhere. */
function chunked(bytes: Buffer, size: number) {
  return {
    open: () =>
      Readable.from(
        (function* () {
          for (let at = 0; at < bytes.length; at += size) {
            yield bytes.subarray(at, at + size);
          }
        })(),
      ),
  };
}

/** The census an upload would store for `stored` (its decoded text `text`), with a mark every `markBytes` or so. */
function censusOf(stored: Buffer, markBytes: number, text = stored): StoredCensus {
  const taker = new LogCensusTaker(markBytes);
  for (let at = 0; at < text.length; at += 1000) taker.push(text.subarray(at, at + 1000));
  return { sha256: createHash('sha256').update(stored).digest('hex'), census: taker.finish() };
}

/** A result without what describes the file as stored (a gzip file differs there, and so in its fingerprint). */
function analysisOf(result: AnalysisResult) {
  const { input, fingerprint: _fingerprint, ...analysis } = result;
  return { ...analysis, rounds: input.rounds };
}

// A hundred random logs per property: seconds of work, more when the machine runs other suites too.
jest.setTimeout(60_000);

describe('the fast reader (byte scanner with and without the row kernel) agrees with csv-parse', () => {
  let scratch: string;
  beforeAll(() => {
    scratch = mkdtempSync(path.join(tmpdir(), 'bellkeep-agree-'));
  });
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  let n = 0;
  const agree = (threads: number, mustBeReadable: boolean) => async (generated: Log) => {
    const bytes = render(generated);
    const file = path.join(scratch, `log-${n++}.csv`);
    writeFileSync(file, bytes);
    const options = { seed: generated.seed, mapping: { outcomes: generated.outcomes }, profile: { testSelection: { mode: generated.mode }, driftBlocks: 3, minTestRounds: 1 } };
    const reference = await analyseLog({ path: file }, { ...options, reader: 'reference' });
    const fast = await analyseLog({ path: file }, { ...options, threads });
    const scannerAlone = await analyseLog({ path: file }, { ...options, threads, reader: 'scanner' });
    const streamed = await analyseLog(chunked(bytes, generated.chunk), options);
    const zipped = await analyseLog(chunked(gzipSync(bytes), generated.chunk), options);
    expect(fast).toEqual(reference);
    expect(scannerAlone).toEqual(reference);
    expect(streamed).toEqual(reference);
    expect(analysisOf(zipped)).toEqual(analysisOf(reference));
    // Valid rows are readable unless there are none (only blank lines), or more of their span is
    // missing than they hold: then the round column is no trigger counter. Each is INVALID saying so.
    if (!mustBeReadable) return;
    const rounds = recordRounds(generated);
    if (rounds.length === 0) expect(reference.errors[0].message).toContain('no rounds');
    else if (coversItsSpan(rounds)) expect(reference.verdict).not.toBe('INVALID');
    else expect(reference.errors[0].message).toContain('trigger counter');
  };

  it.each([
    ['bad rows', 4],
    ['valid rows only', 0],
  ])('gives the same result on random logs with CRLF, BOM and quoting (%s), however the bytes are cut', async (_, brokenWeight) => {
    await fc.assert(fc.asyncProperty(randomLog(brokenWeight, 150), agree(1, brokenWeight === 0)), { numRuns: 100 });
  });

  it('gives the same result when two worker threads read the halves of a log', async () => {
    await fc.assert(fc.asyncProperty(randomLog(1, 600), agree(2, false)), { numRuns: 6 });
  });

  it('gives the same result in one pass with the census taken at upload (threads, streams, gzip), and the same again when a census does not fit the bytes', async () => {
    await fc.assert(
      fc.asyncProperty(randomLog(1, 600), fc.integer({ min: 64, max: 4096 }), fc.integer({ min: 2, max: 3 }), async (generated, markBytes, threads) => {
        const bytes = render(generated);
        const file = path.join(scratch, `log-${n++}.csv`);
        writeFileSync(file, bytes);
        const options = {
          seed: generated.seed,
          mapping: { outcomes: generated.outcomes },
          profile: { testSelection: { mode: generated.mode }, driftBlocks: 3, minTestRounds: 1 },
          threads,
        };
        const reference = await analyseLog({ path: file }, { ...options, reader: 'reference' });
        const census = censusOf(bytes, markBytes);
        const misfits: string[] = [];
        const onCensusMismatch = (reason: string) => misfits.push(reason);
        expect(await analyseLog({ path: file }, { ...options, census, onCensusMismatch })).toEqual(reference);
        expect(await analyseLog(chunked(bytes, generated.chunk), { ...options, census, onCensusMismatch })).toEqual(reference);
        const zipped = gzipSync(bytes);
        const zippedCensus = censusOf(zipped, markBytes, bytes);
        expect(analysisOf(await analyseLog(chunked(zipped, generated.chunk), { ...options, census: zippedCensus, onCensusMismatch }))).toEqual(analysisOf(reference));
        expect(misfits).toEqual([]);
        // A census one record off, or taken of other bytes: told, and the log counted again. (A log
        // without rounds, or whose span is refused, is refused before its ranges are read, which
        // proves nothing of its census.)
        const refusedUnread = reference.input.rounds === 0 || reference.errors.some((problem) => problem.message.includes('trigger counter'));
        for (const lying of [
          { ...census, census: { ...census.census, records: census.census.records + 1 } },
          { ...census, sha256: '0'.repeat(64) },
        ]) {
          misfits.length = 0;
          expect(await analyseLog({ path: file }, { ...options, census: lying, onCensusMismatch })).toEqual(reference);
          expect(await analyseLog(chunked(bytes, generated.chunk), { ...options, census: lying, onCensusMismatch })).toEqual(reference);
          if (!refusedUnread) expect(misfits).toHaveLength(2);
        }
      }),
      { numRuns: 12 },
    );
  });
});
