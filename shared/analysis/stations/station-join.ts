import { TriggerSpan } from '../log/range-plans';
import { JoinedBatch } from './joined-round';
import { RecordGaps, RecordGapTracker } from './record-gaps';
import { RowCursor } from './row-cursor';
import { checkedStatedOffset, StatedOffset } from './stated-offset';
import { StationBatch } from './station-batch';

/** Joined rounds handed on at a time, at most. */
export const JOINED_BATCH_ROUNDS = 4096;

/** What the join of two station records found, numbered as station A numbers its rounds. */
export interface StationJoinSummary {
  /** The offset applied by the caller, or null: A's round r joined B's round r. */
  statedOffset: StatedOffset | null;
  /** Rounds both records hold. */
  joinedRounds: number;
  /** The first and last joined round, or null when none. */
  firstJoinedRound: number | null;
  lastJoinedRound: number | null;
  /**
   * From the first to the last round index either record holds (B's taken back by the offset):
   * the trigger span the joined stream stands for. Null when neither record holds a round.
   */
  span: TriggerSpan | null;
  /**
   * Triggers of the span without a joined round, span.triggers − joinedRounds: the missing rounds of
   * the joined stream under the soundness rules (a round only one station recorded is missing, never
   * neutral), its two ends included.
   */
  missing: number;
  /** Of those, the round indices neither record holds. */
  missingFromBoth: number;
  /** What station A's record lacks: the rounds only B recorded, and A's longest gap. */
  stationA: RecordGaps;
  /** What station B's record lacks: the rounds only A recorded, and B's longest gap. */
  stationB: RecordGaps;
}

/** How two records are joined. */
export interface StationJoinOptions {
  /** Pairs A's round r with B's round r + k, on the caller's word (see `StatedOffset`); default none (k = 0). */
  statedOffset?: StatedOffset;
  /** Joined rounds per batch handed on; default `JOINED_BATCH_ROUNDS`. */
  batchRounds?: number;
}

/**
 * The merge join of two station records sorted by round index, in one streaming pass: station A's
 * round r meets station B's round r + k (k = 0 unless the caller states an offset). Holds one batch
 * of each record and one batch of joined rounds, whatever the length of the night. Counts as it goes
 * the rounds only one record holds, per side; `summary` is complete once `rounds` has been read to
 * its end. Never realigns on its own: see `scanOffsets` for the check that reports a shift.
 */
export class StationJoin {
  private readonly offset: number;
  private readonly statedOffset: StatedOffset | null;
  private readonly batchRounds: number;
  private readonly gapsA = new RecordGapTracker();
  private readonly gapsB = new RecordGapTracker();
  private joined = 0;
  private firstJoined: number | null = null;
  private lastJoined: number | null = null;

  constructor(
    private readonly recordA: AsyncIterable<StationBatch>,
    private readonly recordB: AsyncIterable<StationBatch>,
    options: StationJoinOptions = {},
  ) {
    this.statedOffset = options.statedOffset === undefined ? null : checkedStatedOffset(options.statedOffset);
    this.offset = this.statedOffset?.rounds ?? 0;
    this.batchRounds = options.batchRounds ?? JOINED_BATCH_ROUNDS;
  }

  /**
   * The joined rounds in increasing round order, in batches of at most `batchRounds` (never empty).
   * The same batch is refilled: its rounds are valid until the next is asked for. Read once.
   */
  async *rounds(): AsyncGenerator<JoinedBatch> {
    const a = new RowCursor(this.recordA);
    const b = new RowCursor(this.recordB);
    const out = new JoinedBatch(this.batchRounds);
    try {
      for (;;) {
        const aReady = a.hasRow || (await a.refill());
        const bReady = b.hasRow || (await b.refill());
        if (aReady && bReady) {
          out.timed = a.batch.timed && b.batch.timed;
          this.mergeWhileBoth(a, b, out);
        } else if (aReady) {
          for (; a.hasRow; a.at++) this.onlyA(a.round);
        } else if (bReady) {
          for (; b.hasRow; b.at++) this.onlyB(b.round - this.offset);
        } else {
          break;
        }
        if (out.full) {
          yield out;
          out.length = 0;
        }
      }
    } finally {
      await Promise.all([a.close(), b.close()]);
    }
    if (out.length > 0) yield out;
  }

  /** Joins while both cursors have rows at hand and the batch has room. */
  private mergeWhileBoth(a: RowCursor, b: RowCursor, out: JoinedBatch): void {
    const offset = this.offset;
    const rowsA = a.batch;
    const rowsB = b.batch;
    let i = a.at;
    let j = b.at;
    while (i < rowsA.length && j < rowsB.length && !out.full) {
      const roundA = rowsA.round[i];
      const roundB = rowsB.round[j] - offset;
      if (roundA === roundB) {
        out.add(rowsA, i, rowsB, j);
        this.gapsA.holds(roundB);
        this.gapsB.holds(roundB);
        this.joined++;
        this.firstJoined ??= roundB;
        this.lastJoined = roundB;
        i++;
        j++;
      } else if (roundA < roundB) {
        this.onlyA(roundA);
        i++;
      } else {
        this.onlyB(roundB);
        j++;
      }
    }
    a.at = i;
    b.at = j;
  }

  private onlyA(round: number): void {
    this.gapsA.holds(round);
    this.gapsB.lacks(round);
  }

  private onlyB(round: number): void {
    this.gapsB.holds(round);
    this.gapsA.lacks(round);
  }

  /** What the join found (complete once `rounds` has been read to its end). */
  summary(): StationJoinSummary {
    const span = unionSpan(this.gapsA.held, this.gapsB.held);
    const stationA = this.gapsA.summary(span);
    const stationB = this.gapsB.summary(span);
    const missing = span === null ? 0 : span.triggers - this.joined;
    return {
      statedOffset: this.statedOffset,
      joinedRounds: this.joined,
      firstJoinedRound: this.firstJoined,
      lastJoinedRound: this.lastJoined,
      span,
      missing,
      missingFromBoth: missing - stationA.lacking - stationB.lacking,
      stationA,
      stationB,
    };
  }
}

/** The span from the first to the last round either record holds. */
function unionSpan(a: { first: number; last: number } | null, b: { first: number; last: number } | null): TriggerSpan | null {
  const held = [a, b].filter((edges) => edges !== null);
  if (held.length === 0) return null;
  const firstRound = Math.min(...held.map((edges) => edges.first));
  const lastRound = Math.max(...held.map((edges) => edges.last));
  return { firstRound, lastRound, triggers: lastRound - firstRound + 1 };
}
