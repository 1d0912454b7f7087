import { lightTime, SPEED_OF_LIGHT_M_PER_S } from './light-time';

describe('lightTime', () => {
  it('gives 1 km as 3 335 640.951 981 5… ps, exactly', () => {
    // By hand: d/c = 1000 m / 299 792 458 m/s = 10¹⁵ / 299 792 458 ps.
    //   299 792 458 × 3 335 640 = 899 377 374 000 000 + 100 622 340 603 120 = 999 999 714 603 120,
    //   10¹⁵ − 999 999 714 603 120 = 285 396 880, and 285 396 880 / 299 792 458 = 0.951 981 520 5…
    // so d/c = 3 335 640 + 285 396 880 / 299 792 458 ps = 3 335 640.951 981 5… ps.
    const time = lightTime(1000);
    expect(time).toEqual({ whole: 3_335_640n, remainder: 285_396_880n, divisor: 299_792_458n });
    expect(Number(time.remainder) / Number(time.divisor)).toBeCloseTo(0.9519815205, 10);
  });

  it('gives 1.3 km as 4 336 333.237 6… ps', () => {
    // 1.3·10¹⁵ / 299 792 458: 299 792 458 × 4 336 333 = 1 299 999 928 776 514 (by hand: × 4 000 000 =
    // 1 199 169 832 000 000, × 336 333 = 100 830 096 776 514), remainder 71 223 486, /c = 0.237 576…
    expect(lightTime(1300)).toEqual({ whole: 4_336_333n, remainder: 71_223_486n, divisor: SPEED_OF_LIGHT_M_PER_S });
  });

  it('takes the distance in whole micrometres, rounded down: never a later arrival than the truth', () => {
    // 1 m = 3 335.640 951… ps; 1.0000009 m is read as 1.000000 m.
    expect(lightTime(1.0000009).whole).toBe(3_335n);
    expect(lightTime(1e-6)).toEqual({ whole: 0n, remainder: 1_000_000n, divisor: SPEED_OF_LIGHT_M_PER_S });
  });

  it('refuses a distance that is not above 0', () => {
    expect(() => lightTime(0)).toThrow('the distance between the stations must be above 0 m, not 0');
    expect(() => lightTime(Number.NaN)).toThrow('not NaN');
  });
});
