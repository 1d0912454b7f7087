import { Pipe, type PipeTransform } from '@angular/core';

import { browserLocale } from './local-dates';

/**
 * How much of a date the app shows:
 * - `day`: the calendar day (a night, an acquisition date, the day a thing was made);
 * - `weekday`: the day with its weekday;
 * - `minute` / `second`: an instant, to the minute or second, with its zone;
 * - `recent`: an instant to the minute without its year, where the column is narrow and the year plain;
 * - `time`: the time of day of an instant, with its zone.
 */
export type DateShape = 'day' | 'weekday' | 'minute' | 'second' | 'recent' | 'time';

const SHAPES: Record<DateShape, Intl.DateTimeFormatOptions> = {
  day: { day: 'numeric', month: 'short', year: 'numeric' },
  weekday: { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' },
  // "shortOffset" names the zone by its offset with the minutes it has: GMT+1, GMT+5:30, GMT−3:30.
  minute: { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZoneName: 'shortOffset' },
  second: { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', second: '2-digit', timeZoneName: 'shortOffset' },
  recent: { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', timeZoneName: 'shortOffset' },
  time: { hour: '2-digit', minute: '2-digit', timeZoneName: 'shortOffset' },
};

/** A calendar day as the API writes it: no time, no zone. */
const CALENDAR_DAY = /^\d{4}-\d{2}-\d{2}$/;

const formats = new Map<string, Intl.DateTimeFormat>();

/** The formatter of a shape in a locale and zone, made once. */
function formatOf(shape: DateShape, locale: string, timeZone: string | undefined): Intl.DateTimeFormat {
  const key = `${shape} ${locale} ${timeZone ?? ''}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(locale, { ...SHAPES[shape], timeZone });
    formats.set(key, format);
  }
  return format;
}

/**
 * A date as the app shows it everywhere: in the reader's locale (the browser's language, as the
 * date fields take dates) and, for an instant, in the browser's zone, named. A calendar day
 * (YYYY-MM-DD) is that day wherever the reader is. `options` fix the locale and zone (for tests).
 */
export function shownDate(value: string | Date, shape: DateShape, options: { locale?: string; timeZone?: string } = {}): string {
  const day = typeof value === 'string' && CALENDAR_DAY.test(value);
  const date = typeof value === 'string' ? new Date(day ? `${value}T00:00:00Z` : value) : value;
  if (Number.isNaN(date.getTime())) return String(value);
  // A calendar day has no zone: read and written in UTC it stays the day it names.
  const format = formatOf(day ? (shape === 'weekday' ? 'weekday' : 'day') : shape, options.locale ?? browserLocale(), day ? 'UTC' : options.timeZone);
  return format
    .formatToParts(date)
    .map((part) => (part.type === 'timeZoneName' ? zoneName(part.value) : part.value))
    .join('');
}

/** The zone name of offset zero ("GMT", "GMT+0"), which the app and the PDF call UTC. */
const ZERO_OFFSET = /^GMT([+-]0(:00)?)?$/;

/**
 * A zone as shown: offset zero as UTC; a zone west of it with a minus sign (U+2212), as the app
 * writes negative numbers, which a line never breaks after as it may after a hyphen ("GMT-" / "5").
 */
function zoneName(name: string): string {
  return ZERO_OFFSET.test(name) ? 'UTC' : name.replace('-', '\u2212');
}

/** `shownDate` in a template: `{{ run.createdAt | shownDate: 'minute' }}`; empty for no date. */
@Pipe({ name: 'shownDate' })
export class ShownDatePipe implements PipeTransform {
  transform(value: string | Date | null | undefined, shape: DateShape = 'day'): string {
    return value === null || value === undefined || value === '' ? '' : shownDate(value, shape);
  }
}
