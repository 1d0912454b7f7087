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
  /** Generation rounds in cells 0..23, test rounds in 24..47: a test round is counted COUNT_CELLS further on. */
  private readonly cells = new Float64Array(2 * COUNT_CELLS);
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

  /**
   * Adds round `index` (log order) with its round number, settings, outcomes and selection (`isTest`
   * 1 or 0). Written without branches on the values: settings and selection are random, and a
   * branch on them would be mispredicted about every other round.
   */
  add(index: number, round: number, x: number, y: number, a: number, b: number, isTest: number): void {
    while (index >= this.nextBlockStart) {
      this.block++;
      this.nextBlockStart = firstRoundOfBlock(this.block + 1, this.totalRounds, this.blocks);
    }
    // countCell(x, y, a, b), written out: this runs once per round.
    this.cells[isTest * COUNT_CELLS + ((x * 3 + y) * 2 + a) * 2 + b]++;
    const rounds = this.block * 2;
    if (Number.isNaN(this.blockRounds[rounds])) {
      this.blockRounds[rounds] = round;
    }
    this.blockRounds[rounds + 1] = round;
    if (isTest === 0) {
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
    return {
      test: Array.from(this.cells.subarray(COUNT_CELLS)),
      generation: Array.from(this.cells.subarray(0, COUNT_CELLS)),
      blockStats: Array.from(this.blockStats),
      blockRounds: Array.from(this.blockRounds),
    };
  }
}
