import { formatDuration } from './duration';

describe('formatDuration', () => {
  it('writes hours and minutes', () => {
    expect(formatDuration(3 * 3600 + 20 * 60)).toBe('3 h 20 min');
  });

  it('writes days and hours for more than a day', () => {
    expect(formatDuration(86_400 + 3600)).toBe('1 d 1 h');
    expect(formatDuration(2 * 86_400 + 5 * 3600 + 40 * 60)).toBe('2 d 6 h');
  });

  it('writes minutes and seconds under an hour, seconds alone under a minute', () => {
    expect(formatDuration(16 * 60 + 40)).toBe('16 min 40 s');
    expect(formatDuration(45)).toBe('45 s');
  });

  it('leaves out a smaller part that rounds to zero', () => {
    expect(formatDuration(7200)).toBe('2 h');
    expect(formatDuration(7200 + 20)).toBe('2 h');
  });

  it('rounds up into the next unit rather than writing 60 of the smaller one', () => {
    expect(formatDuration(3600 - 10)).toBe('1 h');
    expect(formatDuration(59.6)).toBe('1 min');
  });

  it('groups the digits of a long acquisition', () => {
    expect(formatDuration(1234 * 86_400)).toBe('1\u2009234 d');
  });

  it('says under a second for a moment, and an en dash for no duration', () => {
    expect(formatDuration(0.2)).toBe('under 1 s');
    expect(formatDuration(null)).toBe('–');
    expect(formatDuration(Number.POSITIVE_INFINITY)).toBe('–');
    expect(formatDuration(-5)).toBe('–');
  });
});
