import { localDeterministic, THREE_WIN_STRATEGIES, type ModelRound } from '@fixtures/adversaries';
import type { AnalysisResult, Verdict } from '../../result';
import { pairSources, stationHalf, UNTIMED } from './testing/pair-sources';
import { analyseStationPair } from './analyse-station-pair';

// A referee's attack on the ends of two station records: a local model (a uniform mixture of the
// three-win deterministic strategies, Bell 1964; CHSH 1969: every CHSH round won with probability
// ¾), and a station B that, having seen the outcomes, keeps only the stretch of the night that looks
// best: it cuts its record's start where the wins over ¾ are lowest and its end where they are
// highest, within the first and last quarter. With the ends counted, B's cuts are missing rounds
// over the span of A's record, the test decisions are the untrimmed pair's (same span, same seed),
// and each cut round drawn for testing is a lost game: the trimmed pair can never look better.

const ROUNDS = 20_000;
const sourceSeed = (i: number) => `a7${i.toString(16).padStart(62, '0')}`;
const selectionSeed = (i: number) => `d2${i.toString(16).padStart(62, '0')}`;
/** A lax profile: only the Bell-violation rule and the missing rounds stand between a source and ACCEPT. */
const LAX = { criterion: 'observed', chshTolerance: 0.1, missingRoundsTolerance: 0.4, minTestRounds: 100 };
const RANK: Record<Verdict, number> = { INVALID: 0, ABORT: 1, ACCEPT: 2 };

/** The stretch of the run B keeps: start and end cut where the running excess of CHSH wins over ¾ is lowest and highest. */
function bestLookingStretch(rounds: readonly ModelRound[]): { first: number; last: number } {
  const excess = [0];
  for (const r of rounds) {
    const score = r.y === 2 ? 0 : (r.a ^ r.b) === r.x * r.y ? 0.25 : -0.75;
    excess.push(excess[excess.length - 1] + score);
  }
  const quarter = Math.floor(rounds.length / 4);
  const argBest = (from: number, to: number, better: (one: number, other: number) => boolean) =>
    Array.from({ length: to - from + 1 }, (_, i) => from + i).reduce((best, i) => (better(excess[i], excess[best]) ? i : best), from);
  const first = argBest(0, quarter, (one, other) => one < other);
  const end = argBest(rounds.length - quarter, rounds.length, (one, other) => one > other);
  return { first, last: end - 1 };
}

describe('a station record trimmed at its ends by a local model (each over several seeds)', () => {
  it.each([0, 1, 2, 3])('never looks better than the untrimmed pair, and never passes (seed %i)', async (seed) => {
    const rounds = [...localDeterministic({ rounds: ROUNDS, strategy: [...THREE_WIN_STRATEGIES] }, sourceSeed(seed))];
    const { first, last } = bestLookingStretch(rounds);
    const kept = rounds.filter((r) => r.round >= first && r.round <= last);
    const judge = async (b: ModelRound[]): Promise<AnalysisResult> => {
      const logs = pairSources({ A: stationHalf(rounds, 'A'), B: stationHalf(b, 'B') }, UNTIMED);
      return analyseStationPair(logs.A, logs.B, { profile: LAX, seed: selectionSeed(seed) });
    };
    const untrimmed = await judge(rounds);
    const trimmed = await judge(kept);

    expect(ROUNDS - kept.length).toBeGreaterThan(0);
    expect(trimmed.missingRounds).toMatchObject({ firstRound: 0, lastRound: ROUNDS - 1, triggers: ROUNDS, missing: ROUNDS - kept.length });
    // The same triggers are drawn for testing: a kept round keeps its decision, a cut one becomes a lost game.
    expect(trimmed.selection!.testRounds + trimmed.missingRounds!.drawnForTesting).toBe(untrimmed.selection!.testRounds);
    expect(trimmed.chsh!.winFraction!).toBeLessThanOrEqual(untrimmed.chsh!.winFraction! + 1e-12);
    expect(trimmed.chsh!.winFractionLower!).toBeLessThanOrEqual(untrimmed.chsh!.winFractionLower! + 1e-12);
    expect(trimmed.chsh!.log10PValue).toBeGreaterThanOrEqual(untrimmed.chsh!.log10PValue - 1e-9);
    expect(RANK[trimmed.verdict]).toBeLessThanOrEqual(RANK[untrimmed.verdict]);
    expect(trimmed.verdict).toBe('ABORT');
    expect(trimmed.reasons.join(' ')).toContain('no significant Bell violation');
  });
});
