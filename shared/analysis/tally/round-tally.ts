import { blockOfRound, firstRoundOfBlock } from './block-layout';
import { COUNT_CELLS } from './count-table';

/** Per-block statistics, four numbers per block: CHSH test rounds, wins, key-setting test rounds, errors (written out as 4 in `add`). */
export const BLOCK_STATS = 4;

/** Per-block round range, two numbers per block: first and last round index, NaN when empty (written out as 2 in `add`). */
export const BLOCK_ROUNDS = 2;

/** The counts of a stretch of log, as plain numbers so they can cross threads and merge exactly. */
export interface TallyCounts {
  /** Test rounds, flat `countCell` order. */
  test: number[];
  /** Generation rounds, flat `countCell` order. */
  generation: number[];
  /** `BLOCK_STATS` numbers per block. */
  blockStats: number[];
  /** `BLOCK_ROUNDS` numbers per block. */
  blockRounds: number[];
}

/**
 * Counts valid rounds by settings and outcomes, separately for test and generation rounds, and the
 * test statistics of each stationarity block.
 */
export class RoundTally {
  private readonly test = new Float64Array(COUNT_CELLS);
  private readonly generation = new Float64Array(COUNT_CELLS);
  private readonly blockStats: Float64Array;
  private readonly blockRounds: Float64Array;
  private block: number;
  private nextBlockStart: number;

  constructor(
    private readonly totalRounds: number,
    private readonly blocks: number,
    firstRound: number,
  ) {
    this.blockStats = new Float64Array(blocks * BLOCK_STATS);
    this.blockRounds = new Float64Array(blocks * BLOCK_ROUNDS).fill(NaN);
    this.block = blockOfRound(firstRound, totalRounds, blocks);
    this.nextBlockStart = firstRoundOfBlock(this.block + 1, totalRounds, blocks);
  }

  /** Adds round `index` (log order) with its round number, settings, outcomes and selection. */
  add(index: number, round: number, x: number, y: number, a: number, b: number, isTest: boolean): void {
    while (index >= this.nextBlockStart) {
      this.block++;
      this.nextBlockStart = firstRoundOfBlock(this.block + 1, this.totalRounds, this.blocks);
    }
    // countCell(x, y, a, b), written out: this runs once per round.
    (isTest ? this.test : this.generation)[((x * 3 + y) * 2 + a) * 2 + b]++;
    const rounds = this.block * 2;
    if (Number.isNaN(this.blockRounds[rounds])) {
      this.blockRounds[rounds] = round;
    }
    this.blockRounds[rounds + 1] = round;
    if (!isTest) {
      return;
    }
    const stats = this.block * 4;
    if (y < 2) {
      this.blockStats[stats]++;
      this.blockStats[stats + 1] += (a ^ b) === (x & y) ? 1 : 0;
    } else if (x === 0) {
      this.blockStats[stats + 2]++;
      this.blockStats[stats + 3] += a !== b ? 1 : 0;
    }
  }

  /** The counts so far. */
  counts(): TallyCounts {
    return { test: Array.from(this.test), generation: Array.from(this.generation), blockStats: Array.from(this.blockStats), blockRounds: Array.from(this.blockRounds) };
  }
}
