import { ShownDatePipe, shownDate } from './shown-dates';

describe('shownDate', () => {
  const instant = '2026-12-04T21:07:09.000Z';

  it('writes a day in the reader’s locale: its order, its month words', () => {
    expect(shownDate('2026-12-04', 'day', { locale: 'en-GB' })).toBe('4 Dec 2026');
    expect(shownDate('2026-12-04', 'day', { locale: 'en-US' })).toBe('Dec 4, 2026');
    expect(shownDate('2026-12-04', 'day', { locale: 'de-DE' })).toBe('4. Dez. 2026');
    expect(shownDate('2026-12-04', 'weekday', { locale: 'en-GB' })).toBe('Fri, 4 Dec 2026');
  });

  it('keeps a calendar day the day it names in any zone', () => {
    expect(shownDate('2026-12-04', 'day', { locale: 'en-GB', timeZone: 'Pacific/Honolulu' })).toBe('4 Dec 2026');
    expect(shownDate('2026-12-04', 'minute', { locale: 'en-GB', timeZone: 'Pacific/Kiritimati' })).toBe('4 Dec 2026');
  });

  it('writes an instant with its zone, a half-hour zone with its minutes', () => {
    expect(shownDate(instant, 'minute', { locale: 'en-GB', timeZone: 'Europe/Berlin' })).toBe('4 Dec 2026, 22:07 GMT+1');
    expect(shownDate(instant, 'minute', { locale: 'en-GB', timeZone: 'Asia/Kolkata' })).toBe('5 Dec 2026, 02:37 GMT+5:30');
    expect(shownDate(instant, 'second', { locale: 'en-GB', timeZone: 'UTC' })).toBe('4 Dec 2026, 21:07:09 UTC');
    expect(shownDate(instant, 'time', { locale: 'en-GB', timeZone: 'America/St_Johns' })).toBe('17:37 GMT\u22123:30');
    expect(shownDate(instant, 'recent', { locale: 'de-DE', timeZone: 'Europe/Berlin' })).toBe('4. Dez., 22:07 GMT+1');
  });

  it('leaves what is not a date as it is, and shows nothing for no date', () => {
    expect(shownDate('soon', 'day', { locale: 'en-GB' })).toBe('soon');
    expect(new ShownDatePipe().transform(null)).toBe('');
  });
});
