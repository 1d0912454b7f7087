/** The four times of a joined round, each in picoseconds since its own station's epoch. */
export interface RoundTimes {
  aSetting: bigint;
  aOutcome: bigint;
  bSetting: bigint;
  bOutcome: bigint;
}

/** One round both stations recorded, as a joined log's record holds it. */
export interface JoinedRound {
  /** Station A's round index (with a stated offset k, B recorded it as round + k). */
  round: number;
  x: number;
  y: number;
  a: number;
  b: number;
  /** Both stations' times, or null when either log has none. */
  times: RoundTimes | null;
}
