import { errorFunction } from 'simple-statistics';
import { chiSquaredIndependence } from './independence-test';

describe('chiSquaredIndependence', () => {
  it('matches a hand-computed 2×2 table', () => {
    // Hand computation: [[10, 20], [30, 40]], margins 30/70 and 40/60: χ² = 0.7936508, dof 1,
    // p = erfc(sqrt(χ²/2)) = 0.3729985 (Abramowitz & Stegun 26.4.4, erf from simple-statistics).
    const test = chiSquaredIndependence([
      [10, 20],
      [30, 40],
    ]);
    expect(test.statistic).toBeCloseTo(0.7936508, 6);
    expect(test.degreesOfFreedom).toBe(1);
    expect(test.pValue).toBeCloseTo(1 - errorFunction(Math.sqrt(test.statistic / 2)), 6);
    expect(test.pValue).toBeCloseTo(0.3729985, 5);
  });

  it('drops empty rows and columns', () => {
    const test = chiSquaredIndependence([
      [10, 0, 20],
      [0, 0, 0],
      [30, 0, 40],
    ]);
    expect(test.degreesOfFreedom).toBe(1);
    expect(test.statistic).toBeCloseTo(0.7936508, 6);
  });

  it('has nothing to test when a column is empty throughout', () => {
    expect(
      chiSquaredIndependence([
        [5, 0],
        [7, 0],
      ]).pValue,
    ).toBe(1);
  });
});
