import type { Provider } from '@angular/core';
import { MAT_DATE_LOCALE } from '@angular/material/core';
import { provideLuxonDateAdapter } from '@angular/material-luxon-adapter';
import { DateTime } from 'luxon';

/** The browser's own locale (the reader's language and date order), or the app's default without one. */
export function browserLocale(): string {
  return typeof navigator !== 'undefined' && navigator.language ? navigator.language : 'en-GB';
}

/**
 * Date fields read and show days in the browser's locale (its short date: 31/12/2026, 31.12.2026,
 * 12/31/2026), through Angular Material's Luxon adapter. Give it to a component that holds a
 * date field, so the field works wherever the component is used.
 */
export function provideLocalDates(): Provider[] {
  return [...provideLuxonDateAdapter(), { provide: MAT_DATE_LOCALE, useFactory: browserLocale }];
}

/** The last day of 2026 in `locale`'s short date: how a date is typed there, shown as an example. */
export function shortDateExample(locale: string): string {
  return DateTime.fromObject({ year: 2026, month: 12, day: 31 }, { locale }).toLocaleString(DateTime.DATE_SHORT);
}

/** A day of a date field: a Luxon date from the adapter, or none. */
export type PickedDay = DateTime | null;

/** The day as the API takes it (YYYY-MM-DD, the day the person picked), or undefined for none or a date that cannot be read. */
export function isoDay(day: PickedDay): string | undefined {
  return day?.isValid === true ? (day.toISODate() ?? undefined) : undefined;
}
