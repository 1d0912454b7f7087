/**
 * An offset the caller applies to the join on purpose, never found and applied by Bellkeep itself:
 * station A's round r is paired with station B's round r + `rounds`. The reason is the caller's
 * (who decided it and why), carried into the join's summary so the record says why rounds were
 * paired that way.
 */
export interface StatedOffset {
  /** k: A's round r pairs with B's round r + k. */
  rounds: number;
  /** Why, as the caller states it. */
  reason: string;
}

/** The offset checked: a safe integer and a reason that says something. Throws a RangeError otherwise. */
export function checkedStatedOffset(offset: StatedOffset): StatedOffset {
  if (!Number.isSafeInteger(offset.rounds)) {
    throw new RangeError(`a stated offset must be a whole number of rounds, not ${offset.rounds}`);
  }
  const reason = offset.reason.trim();
  if (reason === '') {
    throw new RangeError('a stated offset needs the reason it is applied');
  }
  return { rounds: offset.rounds, reason };
}
