import fc from 'fast-check';
import { lengthWithLogCost } from './length-with-log-cost';

const b = 4 / Math.LN2;

describe('lengthWithLogCost', () => {
  it('solves y + (4/ln 2)·ln y = x, from negative budgets to ones where exp(x/b) overflows', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e3, max: 1e300, noNaN: true }), (budget) => {
        const y = lengthWithLogCost(budget);
        return y > 0 && Math.abs(y + b * Math.log(y) - budget) <= 1e-9 * Math.max(1, Math.abs(budget));
      }),
    );
  });

  it('is at least x − 4·log2 x for x ≥ 1', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 1e300, noNaN: true }), (budget) => lengthWithLogCost(budget) >= budget - 4 * Math.log2(budget) - 1e-12 * budget));
  });

  it('is 1 at x = 1 and grows with x', () => {
    expect(lengthWithLogCost(1)).toBeCloseTo(1, 12);
    expect(lengthWithLogCost(95_952)).toBeGreaterThan(lengthWithLogCost(95_951));
  });
});
