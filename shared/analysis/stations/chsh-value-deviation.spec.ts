import { Draws } from '@fixtures/adversaries/draws';
import { chshValue, correlator } from '../statistics/chsh-value';
import { chshValueDeviation } from './chsh-value-deviation';

describe('chshValueDeviation', () => {
  it('follows sqrt(2·ln(2/δ)·Σ 1/m_xy) on hand-computed values', () => {
    // m_xy = 250 each, δ = 10⁻⁶/33: Σ 1/m = 0.016; ln(2/δ) = ln(6.6·10⁷) = 1.887070 + 16.118096 = 18.005166;
    // 2 · 18.005166 · 0.016 = 0.576165, whose square root is 0.759056.
    expect(chshValueDeviation([250, 250, 250, 250], 1e-6 / 33)).toBeCloseTo(0.759056, 6);
    // m = 100, 200, 300, 400, δ = 0.05: Σ 1/m = 0.0208333; ln 40 = 3.688879; sqrt(2 · 3.688879 · 0.0208333) = 0.392050.
    expect(chshValueDeviation([100, 200, 300, 400], 0.05)).toBeCloseTo(0.39205, 5);
  });

  it('knows nothing when a setting pair has no rounds', () => {
    expect(chshValueDeviation([10, 0, 10, 10], 0.01)).toBe(Infinity);
  });

  it('covers the true S at least 1 − δ of the time for independent rounds (simulated)', () => {
    // Rounds of a noisy singlet: E_xy = ±V/√2 (S = 2√2·V), outcome products drawn per round.
    const draws = new Draws('5b'.repeat(32));
    const visibility = 0.9;
    const truth = [1, 1, 1, -1].map((sign) => (sign * visibility) / Math.SQRT2);
    const rounds = [100, 200, 300, 400];
    const delta = 0.05;
    const deviation = chshValueDeviation(rounds, delta);
    let misses = 0;
    const trials = 2000;
    for (let trial = 0; trial < trials; trial++) {
      const [e00, e01, e10, e11] = truth.map((e, pair) => {
        let same = 0;
        for (let i = 0; i < rounds[pair]; i++) same += draws.chance((1 + e) / 2);
        return correlator(same, rounds[pair] - same) ?? NaN;
      });
      if (Math.abs(chshValue(e00, e01, e10, e11) - chshValue(truth[0], truth[1], truth[2], truth[3])) >= deviation) misses++;
    }
    expect(misses / trials).toBeLessThanOrEqual(delta);
  });
});
