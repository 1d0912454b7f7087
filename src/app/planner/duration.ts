import { formatCount } from '@shared/format/numbers';

/** Seconds in each unit a duration is written in, largest first. */
const UNITS = [
  { name: 'd', seconds: 86_400 },
  { name: 'h', seconds: 3_600 },
  { name: 'min', seconds: 60 },
] as const;

/**
 * An acquisition time in its two largest units, rounded to the smaller one: 12 000 s → "3 h 20 min",
 * 90 000 s → "1 d 1 h", 45 s → "45 s". A zero smaller part is left out ("2 h"); under half a second
 * reads "under 1 s"; null or a value that is not a duration reads "–".
 */
export function formatDuration(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds) || seconds < 0) return '–';
  if (seconds < 0.5) return 'under 1 s';
  for (const [index, unit] of UNITS.entries()) {
    const smaller = UNITS[index + 1] ?? { name: 's', seconds: 1 };
    // Rounded to the smaller unit first, so 59 min 50 s reads "1 h" rather than "60 min".
    const total = Math.round(seconds / smaller.seconds) * smaller.seconds;
    if (total >= unit.seconds) {
      const whole = Math.floor(total / unit.seconds);
      const rest = Math.round((total - whole * unit.seconds) / smaller.seconds);
      return rest === 0 ? `${formatCount(whole)} ${unit.name}` : `${formatCount(whole)} ${unit.name} ${rest} ${smaller.name}`;
    }
  }
  return `${Math.round(seconds)} s`;
}
