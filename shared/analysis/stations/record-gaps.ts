import { TriggerSpan } from '../log/range-plans';

/** How many of the rounds a record lacks are listed by round index. */
export const LISTED_LACKING = 10;

/** A run of consecutive round indices. */
export interface RoundRun {
  /** Its first round index. */
  firstRound: number;
  /** How many round indices it holds. */
  rounds: number;
}

/** What one station's record lacks within the span both records cover, numbered as the join numbers rounds. */
export interface RecordGaps {
  /** Rounds the other station's record holds and this one lacks: the rounds present on the other side only. */
  lacking: number;
  /** The first of them, at most `LISTED_LACKING`. */
  firstLacking: number[];
  /**
   * The longest run of consecutive round indices of the span that this record lacks, whether or not
   * the other record holds them (the earliest of equal runs); null when it lacks none.
   */
  longestGap: RoundRun | null;
}

/**
 * Follows one station's record through the merge: the round indices it holds, in increasing order,
 * and the rounds only the other record holds. The gaps at its two ends are known only once the span
 * of both records is.
 */
export class RecordGapTracker {
  private lacking = 0;
  private readonly firstLacking: number[] = [];
  private firstHeld: number | null = null;
  private lastHeld: number | null = null;
  private longestInside: RoundRun | null = null;

  /** The record holds round `round`. */
  holds(round: number): void {
    if (this.lastHeld === null) {
      this.firstHeld = round;
    } else {
      const gap = round - this.lastHeld - 1;
      if (gap > (this.longestInside?.rounds ?? 0)) {
        this.longestInside = { firstRound: this.lastHeld + 1, rounds: gap };
      }
    }
    this.lastHeld = round;
  }

  /** The other record holds round `round` and this one does not. */
  lacks(round: number): void {
    this.lacking++;
    if (this.firstLacking.length < LISTED_LACKING) {
      this.firstLacking.push(round);
    }
  }

  /** The first and last round index held, or null when none. */
  get held(): { first: number; last: number } | null {
    return this.firstHeld === null || this.lastHeld === null ? null : { first: this.firstHeld, last: this.lastHeld };
  }

  /** What the record lacks within `span` (the span of both records; null when neither holds a round). */
  summary(span: TriggerSpan | null): RecordGaps {
    const held = this.held;
    const runs: (RoundRun | null)[] =
      span === null
        ? []
        : held === null
          ? [{ firstRound: span.firstRound, rounds: span.triggers }]
          : [run(span.firstRound, held.first - span.firstRound), this.longestInside, run(held.last + 1, span.lastRound - held.last)];
    const longestGap = runs.reduce<RoundRun | null>((longest, next) => (next !== null && next.rounds > (longest?.rounds ?? 0) ? next : longest), null);
    return { lacking: this.lacking, firstLacking: [...this.firstLacking], longestGap };
  }
}

function run(firstRound: number, rounds: number): RoundRun | null {
  return rounds > 0 ? { firstRound, rounds } : null;
}
