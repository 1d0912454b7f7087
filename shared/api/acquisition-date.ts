import { isoDate } from './query-fields';

/** The day `days` after the ISO date `date`, as YYYY-MM-DD. */
function addDays(date: string, days: number): string {
  const day = new Date(`${date}T00:00:00Z`);
  day.setUTCDate(day.getUTCDate() + days);
  return day.toISOString().slice(0, 10);
}

/**
 * The latest night a log can have been acquired on, as YYYY-MM-DD: today somewhere on Earth. The
 * server does not know the lab's zone, and the earliest zone (UTC+14) is a day ahead of UTC.
 */
export function latestAcquisitionDate(now: Date = new Date()): string {
  return addDays(now.toISOString().slice(0, 10), 1);
}

/** The date a run's log was acquired: a real date, and not in the future. */
export const acquisitionDate = /* @__PURE__ */ isoDate.refine((date) => date <= latestAcquisitionDate(), {
  error: (issue) => `${String(issue.input)} is in the future: a log is acquired on or before today`,
});
