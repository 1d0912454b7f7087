/** A night and its acquisition window as the booking form holds them: local `YYYY-MM-DD` and `YYYY-MM-DDTHH:mm`. */
export interface NightWindow {
  night: string;
  windowStart: string;
  windowEnd: string;
}

/** The default window opens at 20:00 on the night's date and closes at 06:00 the next morning, local time. */
const OPENS = '20:00';
const CLOSES = '06:00';

const HOUR_MS = 3_600_000;
/** The server's limits (server/bookings): a window may have opened up to an hour ago, and lasts at most 48 hours. */
const LATE_BOOKING_GRACE_MS = HOUR_MS;
const LONGEST_WINDOW_MS = 48 * HOUR_MS;

const twoDigits = (value: number) => String(value).padStart(2, '0');

/** The local calendar date of `date`, `YYYY-MM-DD`. */
export function localDate(date: Date): string {
  return `${date.getFullYear()}-${twoDigits(date.getMonth() + 1)}-${twoDigits(date.getDate())}`;
}

/** The night of `night` (YYYY-MM-DD): from 20:00 that evening to 06:00 the next morning, local time. */
export function nightWindow(night: string): NightWindow {
  const [year, month, day] = night.split('-').map(Number);
  // By the calendar, not by adding 24 hours: a night across a daylight-saving change is still one night.
  const morning = localDate(new Date(year, month - 1, day + 1));
  return { night, windowStart: `${night}T${OPENS}`, windowEnd: `${morning}T${CLOSES}` };
}

/** The local date-time of `date` to the minute, as a `datetime-local` input holds it. */
export function localDateTime(date: Date): string {
  return `${localDate(date)}T${twoDigits(date.getHours())}:${twoDigits(date.getMinutes())}`;
}

/** Tonight's window at `now`: today's night, opening at 20:00 or now if that has passed. */
export function tonightWindow(now: Date): NightWindow {
  const tonight = nightWindow(localDate(now));
  return new Date(tonight.windowStart) < now ? { ...tonight, windowStart: localDateTime(now) } : tonight;
}

/**
 * The window moved from one night to another by whole days, its times kept: a window edited by
 * hand follows the night it belongs to.
 */
export function moveToNight(window: NightWindow, night: string): NightWindow {
  const days = Math.round((dayOf(night) - dayOf(window.night)) / 86_400_000);
  const moved = (localDateTimeText: string) => {
    const date = new Date(localDateTimeText);
    // By the calendar, not by adding hours: the wall-clock time stays across a daylight-saving change.
    date.setDate(date.getDate() + days);
    return localDateTime(date);
  };
  return { night, windowStart: moved(window.windowStart), windowEnd: moved(window.windowEnd) };
}

/** Noon of a night's date, local time: whole days apart whatever the daylight-saving shifts between. */
function dayOf(night: string): number {
  const [year, month, day] = night.split('-').map(Number);
  return new Date(year, month - 1, day, 12).getTime();
}

/** A local date-time from a `datetime-local` input as the ISO instant the API takes (UTC). */
export function isoFromLocal(localDateTime: string): string {
  return new Date(localDateTime).toISOString();
}

/** What is wrong with a window of local date-times at `now`, in the server's words, or null when it will do. */
export function windowProblem(windowStart: string, windowEnd: string, now: Date): string | null {
  const start = new Date(windowStart).getTime();
  const end = new Date(windowEnd).getTime();
  if (Number.isNaN(start) || Number.isNaN(end)) return 'Give when the window opens and when it closes.';
  if (start < now.getTime() - LATE_BOOKING_GRACE_MS) return 'This window opened more than an hour ago: a night is booked before its acquisition.';
  if (end <= start) return 'The window must close after it opens.';
  if (end - start > LONGEST_WINDOW_MS) return 'A window lasts at most 48 hours.';
  return null;
}
