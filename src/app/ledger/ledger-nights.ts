const DAY_MS = 86_400_000;

/** Nights the ledger shows at once. */
export const NIGHTS_SHOWN = 21;

/** The YYYY-MM-DD of a time, in UTC (nights are dates of the lab's calendar, stored as such). */
export function isoNight(time: number): string {
  return new Date(time).toISOString().slice(0, 10);
}

/** The nights from `from` to `to`, both included, oldest first. */
export function nightsBetween(from: string, to: string): string[] {
  const nights: string[] = [];
  for (let time = Date.parse(from); time <= Date.parse(to); time += DAY_MS) nights.push(isoNight(time));
  return nights;
}

/** The range of NIGHTS_SHOWN nights ending `weeksBack` weeks before `today`. */
export function rangeEnding(today: string, weeksBack: number): { from: string; to: string } {
  const to = Date.parse(today) - weeksBack * 7 * DAY_MS;
  return { from: isoNight(to - (NIGHTS_SHOWN - 1) * DAY_MS), to: isoNight(to) };
}
