import { shareText } from './missing-rounds';

describe('shareText', () => {
  it('gives two significant digits below 99.5 % and whole per cents above, never an exponent', () => {
    expect(shareText(17, 10_000)).toBe('0.17\u2009%');
    expect(shareText(1, 3)).toBe('33\u2009%');
    expect(shareText(9_996, 10_000)).toBe('100\u2009%');
    expect(shareText(5, 5)).toBe('100\u2009%');
    expect(shareText(0, 5)).toBe('0\u2009%');
    expect(shareText(3, 0)).toBe('0\u2009%');
  });
});
