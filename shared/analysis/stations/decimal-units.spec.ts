import { ceilingDivide, floorDivide, scaledInteger } from './decimal-units';

describe('scaledInteger', () => {
  it('keeps the digits of a typed decimal', () => {
    expect(scaledInteger(1300.5, 6, 'down')).toBe(1_300_500_000n);
    expect(scaledInteger(-123_456.789, 3, 'nearest')).toBe(-123_456_789n);
    // 0.1 is 0.1000000000000000055… in binary; its digits, not its binary tail, decide.
    expect(scaledInteger(0.1, 3, 'up')).toBe(100n);
    expect(scaledInteger(1e-7, 9, 'down')).toBe(100n);
  });

  it('rounds down, up and to the nearest as asked, negative values included', () => {
    expect([scaledInteger(1.0015, 3, 'down'), scaledInteger(1.0015, 3, 'up'), scaledInteger(1.0016, 3, 'nearest')]).toEqual([1001n, 1002n, 1002n]);
    expect([scaledInteger(-1.0015, 3, 'down'), scaledInteger(-1.0015, 3, 'up'), scaledInteger(-1.0014, 3, 'nearest')]).toEqual([-1002n, -1001n, -1001n]);
  });

  it('refuses what is not a finite decimal', () => {
    expect(() => scaledInteger(Number.NaN, 3, 'down')).toThrow('NaN cannot be read as a decimal number');
    expect(() => scaledInteger(1e21, 0, 'down')).toThrow('1e+21 cannot be read as a decimal number');
  });
});

describe('floorDivide and ceilingDivide', () => {
  it('round toward −∞ and +∞, unlike bigint division, which truncates', () => {
    expect([floorDivide(7n, 2n), floorDivide(-7n, 2n), floorDivide(-8n, 2n)]).toEqual([3n, -4n, -4n]);
    expect([ceilingDivide(7n, 2n), ceilingDivide(-7n, 2n), ceilingDivide(8n, 2n)]).toEqual([4n, -3n, 4n]);
  });
});
