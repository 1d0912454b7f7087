/** One valid record of a station log, its values decoded. */
export interface StationRow {
  /** The station's trigger count, 0 … 2^53 − 1, strictly increasing down the log. */
  round: number;
  /** x at station A (0, 1), y at station B (0, 1, 2). */
  setting: number;
  /** a or b, 0 or 1 (a log's ±1 decoded: +1 → 0, −1 → 1). */
  outcome: number;
  /** When the setting was chosen, picoseconds since the station's own epoch; null when the log has no times. */
  settingTime: bigint | null;
  /** When the outcome was recorded, picoseconds since the station's own epoch; null likewise. */
  outcomeTime: bigint | null;
}
