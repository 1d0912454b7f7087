import { samplingDeviation } from './sampling-deviation';

describe('samplingDeviation', () => {
  it('matches hand-computed values of the Tomamichel et al. 2012 μ', () => {
    // Hand computation of μ = sqrt((n+k)/(nk) · (k+1)/k · ln(1/ε)):
    // n = k = 100, ε = 1e-10: 0.02 · 1.01 · 23.0258509 = 0.4651222, sqrt = 0.6819987.
    expect(samplingDeviation(100, 100, 1e-10)).toBeCloseTo(0.6819987, 6);
    // k = 10 000, n = 90 000, ε = 1e-6: (100 000 / 9e8) · 1.0001 · 13.8155106 = 0.00153520, sqrt = 0.0391816.
    expect(samplingDeviation(10_000, 90_000, 1e-6)).toBeCloseTo(0.0391816, 6);
  });

  it('is infinite when either side is empty', () => {
    expect(samplingDeviation(0, 10, 1e-6)).toBe(Infinity);
    expect(samplingDeviation(10, 0, 1e-6)).toBe(Infinity);
  });
});
