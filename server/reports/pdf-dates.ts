/**
 * An instant of the report in UTC, to the second: "2025-03-14T07:12:05.123Z" → "2025-03-14 07:12:05 UTC".
 * Every instant in the report is written this way, so an auditor never guesses a time zone.
 */
export function formatInstant(iso: string | null): string {
  if (iso === null) return '–';
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return iso;
  return `${instant.toISOString().slice(0, 19).replace('T', ' ')} UTC`;
}
