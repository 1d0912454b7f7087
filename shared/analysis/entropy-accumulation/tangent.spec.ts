import fc from 'fast-check';
import { QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { LOWEST_QUANTUM_WIN_FRACTION, rateFunction } from './rate-function';
import { tangentAt, tangentValue } from './tangent';
import { tangentGap } from './tangent-gap';

const tangentPoint = fc.double({ min: 0.75, max: 0.85, noNaN: true });
const winProbability = fc.double({ min: LOWEST_QUANTUM_WIN_FRACTION, max: QUANTUM_WIN_FRACTION, noNaN: true });

describe('tangentValue', () => {
  it('touches the rate function at t and follows its slope', () => {
    const tangent = tangentAt(0.82);
    expect(tangentValue(tangent, 0.82)).toBe(rateFunction(0.82));
    expect(tangentValue(tangent, 0.83) - tangentValue(tangent, 0.82)).toBeCloseTo(0.01 * tangent.slope, 12);
  });
});

describe('tangentGap', () => {
  it('is 0 at the tangent point and never negative on [ω_min, ω_max] (η is convex on [¾, ω_max])', () => {
    expect(tangentGap(tangentAt(0.81), 0.81)).toBe(0);
    fc.assert(fc.property(tangentPoint, winProbability, (t, omega) => tangentGap(tangentAt(t), omega) >= -1e-12));
  });
});
