import fc from 'fast-check';
import { balancedHoeffdingDeviation, balancedWinFraction, balancedWinFractionWithLosses, log10BalancedLocalTail } from './balanced-win-fraction';
import { hoeffdingDeviation } from './hoeffding';

const pairsArbitrary = fc
  .array(fc.integer({ min: 1, max: 400 }), { minLength: 4, maxLength: 4 })
  .chain((rounds) => fc.tuple(...rounds.map((m) => fc.integer({ min: 0, max: m }).map((wins) => ({ rounds: m, wins })))));

describe('the balanced win fraction', () => {
  it('weighs the four setting pairs equally (hand computation)', () => {
    // Pairs 00, 01, 10 always won, 11 always lost: ¼·(1 + 1 + 1 + 0) = ¾ however the counts differ
    // (CHSH 1969: the local deterministic strategy a = b = 0).
    expect(
      balancedWinFraction([
        { rounds: 1000, wins: 1000 },
        { rounds: 900, wins: 900 },
        { rounds: 1100, wins: 1100 },
        { rounds: 50, wins: 0 },
      ]),
    ).toBe(0.75);
    expect(
      balancedWinFraction([
        { rounds: 10, wins: 5 },
        { rounds: 0, wins: 0 },
        { rounds: 10, wins: 5 },
        { rounds: 10, wins: 5 },
      ]),
    ).toBeNull();
  });

  it('has the pooled Hoeffding deviation sqrt(ln(1/ε)/(2m)) when the pairs are equal', () => {
    expect(balancedHoeffdingDeviation([2500, 2500, 2500, 2500], 1e-9)).toBeCloseTo(hoeffdingDeviation(10_000, 1e-9), 14);
    expect(balancedHoeffdingDeviation([2500, 0, 2500, 2500], 1e-9)).toBe(Infinity);
  });

  it('never bounds the tail of a fair local source below its exact value (simulated, 2 000 runs)', () => {
    // Each pair won with probability ¾ (a local bound reached); the share of runs whose balanced
    // fraction exceeds ¾ + t must stay below exp(−32t²/Σ1/m) (Hoeffding 1963, Theorem 2).
    const pairRounds = [40, 80, 120, 160];
    const excess = 0.06;
    let seed = 12345;
    const uniform = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    let beyond = 0;
    for (let run = 0; run < 2000; run++) {
      const pairs = pairRounds.map((m) => ({ rounds: m, wins: Array.from({ length: m }, () => (uniform() < 0.75 ? 1 : 0) as number).reduce((a, b) => a + b, 0) }));
      beyond += balancedWinFraction(pairs)! >= 0.75 + excess ? 1 : 0;
    }
    expect(beyond / 2000).toBeLessThanOrEqual(10 ** log10BalancedLocalTail(0.75 + excess, pairRounds) + 0.01);
  });

  it('places missing losses no better than any whole-number placement (brute force over small cases)', () => {
    fc.assert(
      fc.property(pairsArbitrary, fc.integer({ min: 0, max: 12 }), (pairs, missing) => {
        let best = Infinity;
        for (let a = 0; a <= missing; a++)
          for (let b = 0; a + b <= missing; b++)
            for (let c = 0; a + b + c <= missing; c++) {
              const placed = [a, b, c, missing - a - b - c];
              best = Math.min(best, balancedWinFraction(pairs.map((pair, i) => ({ rounds: pair.rounds + placed[i], wins: pair.wins })))!);
            }
        const relaxed = balancedWinFractionWithLosses(pairs, missing)!;
        return relaxed <= best + 1e-12 && relaxed >= best - 0.25;
      }),
      { numRuns: 300 },
    );
  });
});
