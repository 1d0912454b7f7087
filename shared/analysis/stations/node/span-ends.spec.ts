import { createCipheriv } from 'node:crypto';
import { STATION_PAIR_SEED, stationRecord } from '@fixtures/stations/station-pair';
import { pairSources } from './testing/pair-sources';
import { analyseStationPair } from './analyse-station-pair';

// Rounds only one station recorded before the first or after the last joined round are missing
// rounds like any other: the span is the span of both records, every trigger in it takes its test
// decision, and a missing one drawn for testing counts as a lost CHSH game. The decisions are
// re-derived here from the documented rule (shared/analysis/README.md, "Test-round selection"):
// trigger i's u_i is keystream bytes 8i … 8i+7 of AES-256-CTR under the seed with a zero counter,
// big-endian, shifted right by 11 and divided by 2^53.

const ROUNDS = 8_000;
const SEED = '91'.repeat(32);
/** A's record lacks the first 40 triggers, B's the last 60 and a burst of 25 in the middle. */
const A_LACKS = (t: number) => t < 40;
const B_LACKS = (t: number) => t >= ROUNDS - 60 || (t >= 3_000 && t < 3_025);

function uniforms(seedHex: string, count: number): number[] {
  const cipher = createCipheriv('aes-256-ctr', Buffer.from(seedHex, 'hex'), Buffer.alloc(16));
  const bytes = cipher.update(Buffer.alloc(8 * count));
  return Array.from({ length: count }, (_, i) => Number(bytes.readBigUInt64BE(8 * i) >> 11n) / 2 ** 53);
}

function trimmedPair() {
  const a = [...stationRecord('A', { rounds: ROUNDS }, STATION_PAIR_SEED)].filter((row) => !A_LACKS(row.trigger));
  const b = [...stationRecord('B', { rounds: ROUNDS }, STATION_PAIR_SEED)].filter((row) => !B_LACKS(row.trigger));
  return pairSources({ A: a, B: b });
}

describe('the ends of the span of two station records', () => {
  it('counts the rounds one record holds beyond the other at either end as missing, each drawn for testing by the rule', async () => {
    const gamma = 0.3;
    const logs = trimmedPair();
    const result = await analyseStationPair(logs.A, logs.B, { profile: { testSelection: { mode: 'bernoulli', probability: gamma } }, seed: SEED });
    const u = uniforms(SEED, ROUNDS);
    const triggers = Array.from({ length: ROUNDS }, (_, t) => t);
    const missing = triggers.filter((t) => A_LACKS(t) || B_LACKS(t));
    const drawn = (ts: number[]) => ts.filter((t) => u[t] < gamma).length;
    // Not vacuous: each end has missing triggers drawn for testing under this seed.
    expect(drawn(missing.filter((t) => t < 40))).toBeGreaterThan(0);
    expect(drawn(missing.filter((t) => t >= ROUNDS - 60))).toBeGreaterThan(0);

    expect(result.missingRounds).toEqual({ firstRound: 0, lastRound: ROUNDS - 1, triggers: ROUNDS, missing: 125, drawnForTesting: drawn(missing), tolerated: 8 });
    expect(result.chsh?.missingTestRounds).toBe(drawn(missing));
    expect(result.selection?.testRounds).toBe(drawn(triggers.filter((t) => !A_LACKS(t) && !B_LACKS(t))));
    // 125 missing of 8 000 is past the default tolerance of 0.1 %: never a pass.
    expect(result.checks.find((check) => check.id === 'log-integrity')?.status).toBe('fail');
    expect(result.verdict).toBe('ABORT');
  });

  it('draws every test round of a fixed-fraction selection over the whole span, the trailing triggers included', async () => {
    const logs = trimmedPair();
    const result = await analyseStationPair(logs.A, logs.B, { profile: { testSelection: { mode: 'fixed-fraction', fraction: 0.25 } }, seed: SEED });
    // Algorithm S chooses exactly ⌊f·N⌋ of the N triggers: those of joined rounds and those of missing ones.
    expect((result.selection?.testRounds ?? NaN) + (result.missingRounds?.drawnForTesting ?? NaN)).toBe(Math.floor(0.25 * ROUNDS));
    expect(result.missingRounds?.triggers).toBe(ROUNDS);
  });
});
