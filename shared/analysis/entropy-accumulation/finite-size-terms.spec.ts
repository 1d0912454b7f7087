import { smoothingCost } from './smoothing-cost';
import { thirdOrderTerm } from './third-order-term';
import { tradeoffSpread } from './tradeoff-spread';
import { LOWEST_QUANTUM_WIN_FRACTION } from './rate-function';
import { tangentAt } from './tangent';
import { varianceTerm } from './variance-term';

describe('varianceTerm', () => {
  it('matches hand-computed values', () => {
    // Python: ln2/2·(log2 33 + sqrt(2))² = 14.456836685602857; with Var = 3, sqrt(5): 18.370177633357876.
    expect(varianceTerm(0)).toBeCloseTo(14.456836685602857, 12);
    expect(varianceTerm(3)).toBeCloseTo(18.370177633357876, 12);
  });
});

describe('tradeoffSpread', () => {
  it('is 2 + (1 − ω_min)·η′(t), the rise of the tangent from ω_min to 1', () => {
    const tangent = tangentAt(0.81);
    expect(tradeoffSpread(tangent)).toBeCloseTo(2 + (1 - LOWEST_QUANTUM_WIN_FRACTION) * tangent.slope, 12);
  });
});

describe('thirdOrderTerm', () => {
  it('matches a hand-computed value', () => {
    // Python: 2^(0.01·6)·ln(2^6 + e²)³/(6·0.99³·ln 2) = 20.086157888703656.
    expect(thirdOrderTerm(1.01, 6)).toBeCloseTo(20.086157888703656, 10);
  });

  it('grows without bound as α′ approaches 2', () => {
    expect(thirdOrderTerm(1.999, 6)).toBeGreaterThan(1e9 * thirdOrderTerm(1.01, 6));
  });
});

describe('smoothingCost', () => {
  it('matches the exact value where it is easy and 1 + 2·log2(1/ε) for small ε', () => {
    // ε = 0.6: 1 − sqrt(0.64) = 0.2, log2 5 = 2.321928094887363.
    expect(smoothingCost(0.6)).toBeCloseTo(2.321928094887363, 12);
    // 1 − sqrt(1 − ε²) = ε²/2 + O(ε⁴): 1 + 2·log2(1e10) = 67.43856189774725 (the plain difference would give Infinity).
    expect(smoothingCost(1e-10)).toBeCloseTo(67.43856189774725, 10);
  });
});
