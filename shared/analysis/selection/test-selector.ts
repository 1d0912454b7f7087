import { TestSelection } from '../profile';
import { KeystreamSource } from './keystream';
import { UniformStream } from './uniform-stream';

/**
 * Decides, trigger by trigger, whether a round is a test round. Triggers are the round indices of
 * the log's span, counted from its first round index: a round missing from the log still takes its
 * decision, so a missing round drawn for testing can be counted against the run.
 */
export interface TestSelector {
  /**
   * 1 when the next trigger's round is a test round, else 0 (a number, so callers count and index
   * with it without a branch the processor would mispredict half the time); `logMark` is the log's
   * own `test` value (0 or 1, or NaN if absent).
   */
  next(logMark: number): number;
  /**
   * Passes over `count` triggers whose rounds are missing from the log; returns how many of them
   * were drawn for testing. With the log's own marking the marks went with the rounds, so every
   * missing round counts as a test round (the conservative reading).
   */
  skip(count: number): number;
  /** The state a bulk reader (the row kernel) decides the next triggers from, by the same rule. */
  bulk(): BulkSelection;
  /** Takes back the state after a bulk reader used `uniformsUsed` of the uniform numbers. */
  settle(uniformsUsed: number, remainingTests: number, remainingTriggers: number): void;
}

/** What a bulk reader needs to take test decisions itself. */
export interface BulkSelection {
  /** 0 fixed-fraction, 1 Bernoulli, 2 the log's marking. */
  mode: 0 | 1 | 2;
  /** Fixed-fraction: tests and triggers left in the span (Algorithm S's n − chosen and N − i). */
  remainingTests: number;
  remainingTriggers: number;
  /** Bernoulli: γ. */
  probability: number;
  /** The next triggers' uniform numbers (none for the log's marking). */
  uniforms: Float64Array;
}

/** Where a stretch of the log starts among the triggers, and the totals fixed-fraction selection needs. */
export interface SelectionStart {
  /** Trigger (round index − the log's first round index) at which the stretch's selection begins. */
  firstTrigger: number;
  /** Triggers in the whole log's span, N = last round index − first round index + 1. */
  totalTriggers: number;
  /** Test rounds of the whole span, ⌊fraction·N⌋ (fixed-fraction only). */
  totalTests: number;
  /** Test rounds chosen before the stretch (fixed-fraction only). */
  testsBefore: number;
}

/** Number of test rounds fixed-fraction selection chooses among N triggers: ⌊fraction·N⌋. */
export function fixedFractionTests(fraction: number, totalRounds: number): number {
  return Math.floor(fraction * totalRounds);
}

/**
 * Selection sampling (Knuth, TAOCP vol. 2, §3.4.2, Algorithm S): trigger i is chosen when
 * u_i < (n − chosen so far)/(N − i), which yields exactly n test rounds, every subset of that size
 * equally likely. The decision depends only on the keystream, N and n, never on the data.
 */
class FixedFractionSelector implements TestSelector {
  private remainingTests: number;
  private remainingTriggers: number;

  constructor(
    private readonly uniforms: UniformStream,
    start: SelectionStart,
  ) {
    this.remainingTests = start.totalTests - start.testsBefore;
    this.remainingTriggers = start.totalTriggers - start.firstTrigger;
  }

  next(): number {
    const chosen = Number(this.uniforms.next() < this.remainingTests / this.remainingTriggers);
    this.remainingTriggers--;
    this.remainingTests -= chosen;
    return chosen;
  }

  /** `next` over many triggers at once, on the pending uniform numbers in bulk (a stretch's replay of the ones before it runs here). */
  skip(count: number): number {
    let remainingTests = this.remainingTests;
    let remainingTriggers = this.remainingTriggers;
    let tests = 0;
    for (let left = count; left > 0;) {
      const uniforms = this.uniforms.pending();
      const taken = Math.min(left, uniforms.length);
      for (let i = 0; i < taken; i++) {
        const chosen = uniforms[i] < remainingTests / remainingTriggers ? 1 : 0;
        remainingTriggers--;
        remainingTests -= chosen;
        tests += chosen;
      }
      this.uniforms.advance(taken);
      left -= taken;
    }
    this.remainingTests = remainingTests;
    this.remainingTriggers = remainingTriggers;
    return tests;
  }

  bulk(): BulkSelection {
    return { mode: 0, remainingTests: this.remainingTests, remainingTriggers: this.remainingTriggers, probability: NaN, uniforms: this.uniforms.pending() };
  }

  settle(uniformsUsed: number, remainingTests: number, remainingTriggers: number): void {
    this.uniforms.advance(uniformsUsed);
    this.remainingTests = remainingTests;
    this.remainingTriggers = remainingTriggers;
  }
}

/** Each trigger independently with probability γ: trigger i is a test round when u_i < γ. */
class BernoulliSelector implements TestSelector {
  constructor(
    private readonly uniforms: UniformStream,
    private readonly probability: number,
  ) {}

  next(): number {
    return Number(this.uniforms.next() < this.probability);
  }

  skip(count: number): number {
    const probability = this.probability;
    let tests = 0;
    for (let left = count; left > 0;) {
      const uniforms = this.uniforms.pending();
      const taken = Math.min(left, uniforms.length);
      for (let i = 0; i < taken; i++) {
        tests += uniforms[i] < probability ? 1 : 0;
      }
      this.uniforms.advance(taken);
      left -= taken;
    }
    return tests;
  }

  bulk(): BulkSelection {
    return { mode: 1, remainingTests: NaN, remainingTriggers: NaN, probability: this.probability, uniforms: this.uniforms.pending() };
  }

  settle(uniformsUsed: number): void {
    this.uniforms.advance(uniformsUsed);
  }
}

/** The lab's own marking, the `test` column. */
class LogMarkSelector implements TestSelector {
  next(logMark: number): number {
    return Number(logMark === 1);
  }

  skip(count: number): number {
    return count;
  }

  bulk(): BulkSelection {
    return { mode: 2, remainingTests: NaN, remainingTriggers: NaN, probability: NaN, uniforms: NO_UNIFORMS };
  }

  settle(): void {
    // Nothing to take back: the marks are in the log.
  }
}

const NO_UNIFORMS = new Float64Array(0);

/** The selector of a profile's mode for a stretch of the log. */
export function createTestSelector(selection: TestSelection, keystream: KeystreamSource | null, start: SelectionStart): TestSelector {
  if (selection.mode === 'from-log') {
    return new LogMarkSelector();
  }
  if (keystream === null) {
    throw new Error(`test selection ${selection.mode} needs a keystream`);
  }
  const uniforms = new UniformStream(keystream, start.firstTrigger);
  return selection.mode === 'bernoulli' ? new BernoulliSelector(uniforms, selection.probability) : new FixedFractionSelector(uniforms, start);
}

/**
 * Test rounds fixed-fraction selection chooses before each of the given triggers (ascending), by
 * running Algorithm S over the keystream alone: lets a stretch start mid-log.
 */
export function testsBeforeTriggers(keystream: KeystreamSource, totalTriggers: number, totalTests: number, firstTriggers: readonly number[]): number[] {
  const selector = new FixedFractionSelector(new UniformStream(keystream, 0), { firstTrigger: 0, totalTriggers, totalTests, testsBefore: 0 });
  const before: number[] = [];
  let chosen = 0;
  let trigger = 0;
  for (const target of firstTriggers) {
    chosen += selector.skip(Math.max(target - trigger, 0));
    trigger = Math.max(target, trigger);
    before.push(chosen);
  }
  return before;
}
