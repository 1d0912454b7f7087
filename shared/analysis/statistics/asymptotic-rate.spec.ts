import { asymptoticRate } from './asymptotic-rate';

describe('asymptoticRate', () => {
  it('gives one bit per round for ideal devices', () => {
    // Acín et al. 2007: S = 2√2, Q = 0 leave Eve nothing: r = 1.
    expect(asymptoticRate(2 * Math.SQRT2, 0)).toBeCloseTo(1, 12);
  });

  it('falls to zero near Q ≈ 7.1% under depolarising noise, S = 2√2(1 − 2Q)', () => {
    // Pironio et al. NJP 11, 045021 (2009) report the threshold near 7.1% (from memory).
    const rate = (q: number) => asymptoticRate(2 * Math.SQRT2 * (1 - 2 * q), q);
    expect(rate(0.069)).toBeGreaterThan(0);
    expect(rate(0.074)).toBeLessThan(0);
  });

  it('leaves no key at the local bound', () => {
    expect(asymptoticRate(2, 0.02)).toBeLessThan(0);
    expect(asymptoticRate(1.5, 0)).toBe(0);
  });
});
