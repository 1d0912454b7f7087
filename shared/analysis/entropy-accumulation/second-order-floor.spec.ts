import { QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { minTradeoffValues } from './min-tradeoff-function';
import { minTradeoffVariance } from './min-tradeoff-variance';
import { LOWEST_QUANTUM_WIN_FRACTION } from './rate-function';
import { secondOrderFloor } from './second-order-floor';
import { tangentAt } from './tangent';
import { tangentGap } from './tangent-gap';
import { varianceTerm } from './variance-term';

/** The same infimum by brute force: a scan of 200 001 points. */
function scannedFloor(t: number, gamma: number, alphaPrime: number): number {
  const tangent = tangentAt(t);
  const values = minTradeoffValues(tangent, gamma);
  let lowest = Infinity;
  for (let i = 0; i <= 200_000; i++) {
    const omega = LOWEST_QUANTUM_WIN_FRACTION + ((QUANTUM_WIN_FRACTION - LOWEST_QUANTUM_WIN_FRACTION) * i) / 200_000;
    lowest = Math.min(lowest, tangentGap(tangent, omega) - (alphaPrime - 1) * varianceTerm(minTradeoffVariance(values, gamma, omega)));
  }
  return lowest;
}

describe('secondOrderFloor', () => {
  it.each([
    [0.812, 13 / 256, 1.0006],
    [0.78, 0.3, 1.01],
    [0.84, 0.01, 1.05],
    [0.76, 0.5, 1.3],
  ])('agrees with a dense scan at t = %p, γ = %p, α′ = %p', (t, gamma, alphaPrime) => {
    const floor = secondOrderFloor(tangentAt(t), gamma, alphaPrime);
    const scanned = scannedFloor(t, gamma, alphaPrime);
    expect(floor).toBeLessThanOrEqual(scanned + 1e-12);
    expect(floor).toBeGreaterThan(scanned - 1e-8 * Math.max(1, Math.abs(scanned)));
  });

  it('lies below −(α′−1)·V at the tangent point, where Δ is 0', () => {
    const tangent = tangentAt(0.812);
    const atTangent = -(0.001 * varianceTerm(minTradeoffVariance(minTradeoffValues(tangent, 0.05), 0.05, 0.812)));
    expect(secondOrderFloor(tangent, 0.05, 1.001)).toBeLessThan(atTangent);
  });
});
