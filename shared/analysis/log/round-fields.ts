/** The fields of one round, in the order problems are reported within a row. */
export const ROUND_FIELDS = ['round', 'x', 'y', 'a', 'b', 'test'] as const;

/** One field of a round record. */
export type RoundField = (typeof ROUND_FIELDS)[number];

/** Index of each field in value arrays (`values[FIELD.x]`). */
export const FIELD = { round: 0, x: 1, y: 2, a: 3, b: 4, test: 5 } as const;

/** The fields every log must have; `test` is needed only when the lab's marking selects the test rounds. */
export const REQUIRED_FIELDS: readonly RoundField[] = ['round', 'x', 'y', 'a', 'b'];

/** What each field holds, for messages. */
export const FIELD_MEANING: Record<RoundField, string> = {
  round: 'round index',
  x: 'station A setting',
  y: 'station B setting',
  a: 'station A outcome',
  b: 'station B outcome',
  test: 'test marking',
};
