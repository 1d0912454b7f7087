import { FormControl } from '@angular/forms';

import { hexPrefixProblem, hexPrefixQuery, hexPrefixValidator } from './hex-prefix';

describe('hexPrefixProblem', () => {
  it('takes an empty field: it searches by nothing', () => {
    expect(hexPrefixProblem('')).toBeNull();
    expect(hexPrefixProblem('   ')).toBeNull();
  });

  it('takes four or more hex digits in either case, spaces around them ignored', () => {
    expect(hexPrefixProblem('9f3a')).toBeNull();
    expect(hexPrefixProblem(' 9F3AC07E ')).toBeNull();
    expect(hexPrefixProblem('a'.repeat(64))).toBeNull();
  });

  it('refuses letters beyond f and other signs', () => {
    expect(hexPrefixProblem('9f3g')).toBe('Use only the digits 0–9 and the letters a–f.');
    expect(hexPrefixProblem('9f 3a')).toBe('Use only the digits 0–9 and the letters a–f.');
    expect(hexPrefixProblem('0x9f3a')).toBe('Use only the digits 0–9 and the letters a–f.');
  });

  it('refuses a prefix too short to search by', () => {
    expect(hexPrefixProblem('9f3')).toBe('Give at least 4 hexadecimal digits.');
  });

  it('refuses more digits than a SHA-256 has', () => {
    expect(hexPrefixProblem('a'.repeat(65))).toBe('A hash has 64 hexadecimal digits at most.');
  });
});

describe('hexPrefixValidator', () => {
  it('marks the control invalid with the sentence to show', () => {
    const control = new FormControl<string | null>('12', { validators: hexPrefixValidator });
    expect(control.getError('hexPrefix')).toBe('Give at least 4 hexadecimal digits.');
    control.setValue('12ab');
    expect(control.valid).toBe(true);
    control.setValue(null);
    expect(control.valid).toBe(true);
  });
});

describe('hexPrefixQuery', () => {
  it('sends the prefix trimmed and in lower case, and nothing for an empty field', () => {
    expect(hexPrefixQuery(new FormControl<string | null>(' 9F3A '))).toBe('9f3a');
    expect(hexPrefixQuery(new FormControl<string | null>('  '))).toBeNull();
    expect(hexPrefixQuery(new FormControl<string | null>(null))).toBeNull();
  });
});
