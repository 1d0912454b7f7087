import { formatCount, formatFixed, formatLog10, formatPercent, formatScientific } from './numbers';

describe('figure formats', () => {
  it('counts get thin-space thousands separators', () => {
    expect(formatCount(1_500_000)).toBe('1\u2009500\u2009000');
    expect(formatCount(999)).toBe('999');
    expect(formatCount(-12_345)).toBe('−12\u2009345');
  });

  it('fixed decimals, a dash for nothing', () => {
    expect(formatFixed(0.853553, 4)).toBe('0.8536');
    expect(formatFixed(null)).toBe('–');
    expect(formatFixed(Number.NaN)).toBe('–');
  });

  it('scientific notation for ε and p-values', () => {
    expect(formatScientific(1e-9)).toBe('1e-9');
    expect(formatScientific(0.00123)).toBe('1.2e-3');
    expect(formatScientific(0)).toBe('0');
  });

  it('p-values below what a double holds, from their log10', () => {
    expect(formatLog10(-2)).toBe('1e-2');
    expect(formatLog10(-1234.5)).toBe('3.2e-1235');
  });

  it('percentages', () => {
    expect(formatPercent(0.0182)).toBe('1.82\u2009%');
  });
});
