import fc from 'fast-check';
import { aesKeystream } from '../node/aes-keystream';
import { chiSquaredGoodnessOfFit } from '../statistics/goodness-of-fit';
import { createTestSelector, fixedFractionTests, testsBeforeTriggers } from './test-selector';

const seedOf = (i: number) => i.toString(16).padStart(64, '0');

/** The rounds chosen in a log of N rounds. */
function chosen(seed: string, mode: 'fixed-fraction' | 'bernoulli', share: number, rounds: number): number[] {
  const selection = mode === 'bernoulli' ? { mode, probability: share } : { mode, fraction: share };
  const totalTests = fixedFractionTests(share, rounds);
  const selector = createTestSelector(selection, aesKeystream(seed), { firstTrigger: 0, totalTriggers: rounds, totalTests, testsBefore: 0 });
  return Array.from({ length: rounds }, (_, i) => i).filter(() => selector.next(NaN));
}

describe('test selection', () => {
  it('reproduces the worked example of the README (re-derived with openssl enc and Python)', () => {
    // Seed 4b…4b, N = 10: keystream from `openssl enc -aes-256-ctr -K 4b…4b -iv 0…0 -nopad`, the rule
    // computed in Python: fixed-fraction 0.3 chooses rounds 0, 6, 9; Bernoulli 0.5 chooses 0, 1, 3, 4, 6, 9.
    expect(chosen('4b'.repeat(32), 'fixed-fraction', 0.3, 10)).toEqual([0, 6, 9]);
    expect(chosen('4b'.repeat(32), 'bernoulli', 0.5, 10)).toEqual([0, 1, 3, 4, 6, 9]);
  });

  it('chooses exactly ⌊fraction·N⌋ rounds in fixed-fraction mode', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 3000 }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.nat(1e6), (rounds, fraction, seed) => {
        return chosen(seedOf(seed), 'fixed-fraction', fraction, rounds).length === Math.floor(fraction * rounds);
      }),
      { numRuns: 60 },
    );
  });

  it('makes every subset of the size equally likely (chi-squared over 3000 seeds)', () => {
    // Knuth, TAOCP vol. 2, §3.4.2: Algorithm S picks each of the C(6,2) = 15 subsets with
    // probability 1/15. The seeds are fixed, so this statistical check is deterministic.
    const subsets = new Map<string, number>();
    for (let i = 0; i < 3000; i++) {
      const key = chosen(seedOf(i), 'fixed-fraction', 2 / 6, 6).join(',');
      subsets.set(key, (subsets.get(key) ?? 0) + 1);
    }
    expect(subsets.size).toBe(15);
    const test = chiSquaredGoodnessOfFit([...subsets.values()], Array(15).fill(1 / 15));
    expect(test.pValue).toBeGreaterThan(0.001);
  });

  it('tests each round with probability γ in Bernoulli mode', () => {
    // 200 000 rounds at γ = 0.1: mean 20 000, standard deviation sqrt(200 000 · 0.1 · 0.9) ≈ 134.
    const count = chosen(seedOf(7), 'bernoulli', 0.1, 200_000).length;
    expect(Math.abs(count - 20_000)).toBeLessThan(5 * 134);
  });

  it('lets a stretch start mid-log and decide exactly as one reader of the whole log', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 5000 }), fc.nat(1e6), fc.double({ min: 0, max: 1, noNaN: true }), (rounds, seed, cutShare) => {
        const keystream = aesKeystream(seedOf(seed));
        const totalTests = fixedFractionTests(0.5, rounds);
        const whole = chosen(seedOf(seed), 'fixed-fraction', 0.5, rounds);
        const cut = Math.floor(cutShare * rounds);
        const [before] = testsBeforeTriggers(keystream, rounds, totalTests, [cut]);
        const tail = createTestSelector({ mode: 'fixed-fraction', fraction: 0.5 }, keystream, { firstTrigger: cut, totalTriggers: rounds, totalTests, testsBefore: before });
        const tailChosen = Array.from({ length: rounds - cut }, (_, i) => cut + i).filter(() => tail.next(NaN));
        return before === whole.filter((i) => i < cut).length && tailChosen.join() === whole.filter((i) => i >= cut).join();
      }),
      { numRuns: 40 },
    );
  });

  it('counts the tests before stretches as a trigger-by-trigger reader does, across the keystream fetches (8192 triggers each)', () => {
    const rounds = 100_003;
    const keystream = aesKeystream(seedOf(11));
    const totalTests = fixedFractionTests(0.3, rounds);
    const reader = createTestSelector({ mode: 'fixed-fraction', fraction: 0.3 }, keystream, { firstTrigger: 0, totalTriggers: rounds, totalTests, testsBefore: 0 });
    const cuts = [0, 1, 8191, 8192, 8193, 16_385, 50_001, 99_999, rounds];
    const expected: number[] = [];
    let chosenSoFar = 0;
    for (let trigger = 0; trigger <= rounds; trigger++) {
      if (cuts.includes(trigger)) expected.push(chosenSoFar);
      if (trigger < rounds) chosenSoFar += reader.next(NaN);
    }
    expect(testsBeforeTriggers(aesKeystream(seedOf(11)), rounds, totalTests, cuts)).toEqual(expected);
    expect(expected[expected.length - 1]).toBe(totalTests);
  });
});
