import { intervalMinimum } from './interval-minimum';

const SEARCH = { gridPoints: 20, tolerance: 1e-12 };

describe('intervalMinimum', () => {
  it('places the minimum of a smooth function as finely as its values can tell', () => {
    // Near the minimum, values of (x − a)² + 2 differ by less than an ulp of 2 within ~1e-8 of a:
    // no comparison-based search resolves a better than that.
    const found = intervalMinimum((x) => (x - 0.3141) ** 2 + 2, 0, 1, SEARCH);
    expect(found.at).toBeCloseTo(0.3141, 7);
    expect(found.value).toBeCloseTo(2, 12);
  });

  it('keeps a minimum at an end of the interval', () => {
    const found = intervalMinimum((x) => x, -1, 1, SEARCH);
    expect(found).toEqual({ at: -1, value: -1 });
    expect(intervalMinimum((x) => -x, -1, 1, SEARCH).at).toBe(1);
  });

  it('finds the deeper of two basins when the grid resolves them', () => {
    // A shallow basin at 0.2 (value 0.1) and the deeper one at 0.8 (value 0).
    const twoBasins = (x: number) => Math.min((x - 0.2) ** 2 + 0.1, 3 * (x - 0.8) ** 2);
    expect(intervalMinimum(twoBasins, 0, 1, SEARCH).at).toBeCloseTo(0.8, 9);
  });
});
