import { errorFunction } from 'simple-statistics';
import { chiSquaredGoodnessOfFit } from './goodness-of-fit';

describe('chiSquaredGoodnessOfFit', () => {
  it('matches the closed-form tail for two degrees of freedom', () => {
    // Hand computation: [10, 20, 30] against thirds: χ² = (100 + 0 + 100)/20 = 10, dof 2;
    // the chi-squared tail with 2 dof is exp(−χ²/2) exactly (Abramowitz & Stegun 26.4.21) = 0.00673795.
    const test = chiSquaredGoodnessOfFit([10, 20, 30], [1 / 3, 1 / 3, 1 / 3]);
    expect(test.statistic).toBeCloseTo(10, 12);
    expect(test.degreesOfFreedom).toBe(2);
    expect(test.pValue).toBeCloseTo(Math.exp(-5), 9);
  });

  it('matches the erfc form for one degree of freedom (simple-statistics error function)', () => {
    // With 1 dof the tail is erfc(sqrt(χ²/2)) (Abramowitz & Stegun 26.4.4); 55 vs 45 in halves: χ² = 1.
    const test = chiSquaredGoodnessOfFit([55, 45], [0.5, 0.5]);
    expect(test.statistic).toBeCloseTo(1, 12);
    expect(test.pValue).toBeCloseTo(1 - errorFunction(Math.sqrt(0.5)), 6);
  });

  it('has nothing to test without counts', () => {
    expect(chiSquaredGoodnessOfFit([0, 0], [0.5, 0.5]).pValue).toBe(1);
  });
});
