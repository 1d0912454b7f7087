import { TestSelection } from '../profile';
import { KeystreamSource } from './keystream';
import { UniformStream } from './uniform-stream';

/** Decides, round by round in log order, whether a round is a test round. */
export interface TestSelector {
  /** Whether the next round is a test round; `logMark` is the log's own `test` value (0 or 1, or NaN if absent). */
  next(logMark: number): boolean;
}

/** Where a stretch of the log starts, and the totals fixed-fraction selection needs. */
export interface SelectionStart {
  /** Index (0-based, in log order) of the stretch's first round. */
  firstRound: number;
  /** Rounds in the whole log, N. */
  totalRounds: number;
  /** Test rounds of the whole log, ⌊fraction·N⌋ (fixed-fraction only). */
  totalTests: number;
  /** Test rounds chosen before the stretch (fixed-fraction only). */
  testsBefore: number;
}

/** Number of test rounds fixed-fraction selection chooses in a log of N rounds: ⌊fraction·N⌋. */
export function fixedFractionTests(fraction: number, totalRounds: number): number {
  return Math.floor(fraction * totalRounds);
}

/**
 * Selection sampling (Knuth, TAOCP vol. 2, §3.4.2, Algorithm S): round i is chosen when
 * u_i < (n − chosen so far)/(N − i), which yields exactly n test rounds, every subset of that size
 * equally likely. The decision depends only on the keystream, N and n, never on the data.
 */
class FixedFractionSelector implements TestSelector {
  private remainingTests: number;
  private remainingRounds: number;

  constructor(
    private readonly uniforms: UniformStream,
    start: SelectionStart,
  ) {
    this.remainingTests = start.totalTests - start.testsBefore;
    this.remainingRounds = start.totalRounds - start.firstRound;
  }

  next(): boolean {
    const chosen = this.uniforms.next() < this.remainingTests / this.remainingRounds;
    this.remainingRounds--;
    if (chosen) {
      this.remainingTests--;
    }
    return chosen;
  }
}

/** Each round independently with probability γ: round i is a test round when u_i < γ. */
class BernoulliSelector implements TestSelector {
  constructor(
    private readonly uniforms: UniformStream,
    private readonly probability: number,
  ) {}

  next(): boolean {
    return this.uniforms.next() < this.probability;
  }
}

/** The lab's own marking, the `test` column. */
class LogMarkSelector implements TestSelector {
  next(logMark: number): boolean {
    return logMark === 1;
  }
}

/** The selector of a profile's mode for a stretch of the log. */
export function createTestSelector(selection: TestSelection, keystream: KeystreamSource | null, start: SelectionStart): TestSelector {
  if (selection.mode === 'from-log') {
    return new LogMarkSelector();
  }
  if (keystream === null) {
    throw new Error(`test selection ${selection.mode} needs a keystream`);
  }
  const uniforms = new UniformStream(keystream, start.firstRound);
  return selection.mode === 'bernoulli' ? new BernoulliSelector(uniforms, selection.probability) : new FixedFractionSelector(uniforms, start);
}

/**
 * Test rounds fixed-fraction selection chooses before each of the given round indices (ascending),
 * by running Algorithm S over the keystream alone: lets a stretch start mid-log.
 */
export function testsBeforeRounds(keystream: KeystreamSource, totalRounds: number, totalTests: number, firstRounds: readonly number[]): number[] {
  const selector = new FixedFractionSelector(new UniformStream(keystream, 0), { firstRound: 0, totalRounds, totalTests, testsBefore: 0 });
  const before: number[] = [];
  let chosen = 0;
  let round = 0;
  for (const target of firstRounds) {
    for (; round < target; round++) {
      chosen += selector.next() ? 1 : 0;
    }
    before.push(chosen);
  }
  return before;
}
