import { FormControl } from '@angular/forms';

import { parseRoundCount, roundCountValidator } from './round-count';

describe('parseRoundCount', () => {
  it('reads plain digits', () => {
    expect(parseRoundCount('2000000')).toBe(2_000_000);
  });

  it('reads digits grouped by spaces of any kind, thin ones included', () => {
    expect(parseRoundCount('2 000 000')).toBe(2_000_000);
    expect(parseRoundCount('2\u2009000\u2009000')).toBe(2_000_000);
    expect(parseRoundCount('2\u00a0000\u202f000')).toBe(2_000_000);
    expect(parseRoundCount('  150 000 ')).toBe(150_000);
  });

  it('reads digits grouped in threes by commas', () => {
    expect(parseRoundCount('2,000,000')).toBe(2_000_000);
  });

  it('reads a power of ten, with or without a mantissa and a plus sign', () => {
    expect(parseRoundCount('2e6')).toBe(2_000_000);
    expect(parseRoundCount('2.5E6')).toBe(2_500_000);
    expect(parseRoundCount('1e+9')).toBe(1_000_000_000);
  });

  it('refuses commas that are not thousands groups, so 2,5 is never read as 25', () => {
    expect(parseRoundCount('2,5')).toBeNull();
    expect(parseRoundCount('20,00,000')).toBeNull();
  });

  it('refuses fractions of a round, zero, negatives and words', () => {
    expect(parseRoundCount('1.5')).toBeNull();
    expect(parseRoundCount('2.5e0')).toBeNull();
    expect(parseRoundCount('0')).toBeNull();
    expect(parseRoundCount('-2e6')).toBeNull();
    expect(parseRoundCount('2 million')).toBeNull();
    expect(parseRoundCount('')).toBeNull();
  });

  it('refuses counts beyond what a number holds exactly', () => {
    expect(parseRoundCount('1e16')).toBeNull();
    expect(parseRoundCount('1e400')).toBeNull();
  });
});

describe('roundCountValidator', () => {
  it('flags text that is not a number of rounds and leaves empty text to the required check', () => {
    expect(roundCountValidator(new FormControl('2 million'))).toEqual({ roundCount: true });
    expect(roundCountValidator(new FormControl('2e6'))).toBeNull();
    expect(roundCountValidator(new FormControl(''))).toBeNull();
  });
});
