import { blockOfRound, firstRoundOfBlock } from './block-layout';
import { COUNT_CELLS, countCell } from './count-table';

/** Per-block statistics, four numbers per block: CHSH test rounds, wins, key-setting test rounds, errors (written out as 4 in `add`). */
export const BLOCK_STATS = 4;

/** Per-block round range, two numbers per block: first and last round index, NaN when empty (written out as 2 in `add`). */
export const BLOCK_ROUNDS = 2;

/**
 * What a round adds to its block's statistics, by count cell, BLOCK_STATS numbers each: a CHSH test
 * round (y < 2) and whether it wins ((a ⊕ b) = x·y); a key-setting test round (x = 0, y = 2) and
 * whether its outcomes differ. Nothing for a generation round (`BLOCK_ADDS[0]`), the table for a
 * test round (`BLOCK_ADDS[1]`).
 */
export const TEST_ROUND_BLOCK_ADDS = blockAddsOfTestRounds();
const BLOCK_ADDS = [new Float64Array(COUNT_CELLS * BLOCK_STATS), TEST_ROUND_BLOCK_ADDS];

function blockAddsOfTestRounds(): Float64Array {
  const adds = new Float64Array(COUNT_CELLS * BLOCK_STATS);
  for (let x = 0; x < 2; x++) {
    for (let y = 0; y < 3; y++) {
      for (let a = 0; a < 2; a++) {
        for (let b = 0; b < 2; b++) {
          const at = countCell(x, y, a, b) * BLOCK_STATS;
          if (y < 2) {
            adds[at] = 1;
            adds[at + 1] = (a ^ b) === (x & y) ? 1 : 0;
          } else if (x === 0) {
            adds[at + 2] = 1;
            adds[at + 3] = a !== b ? 1 : 0;
          }
        }
      }
    }
  }
  return adds;
}

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
   * 1 or 0).
   */
  add(index: number, round: number, x: number, y: number, a: number, b: number, isTest: number): void {
    // countCell(x, y, a, b), written out: this runs once per round.
    this.addCell(index, round, ((x * 3 + y) * 2 + a) * 2 + b, isTest);
  }

  /**
   * Adds round `index` by its count cell (see `countCell`). Written without branches on the values:
   * settings and selection are random, and a branch on them would be mispredicted about every other
   * round; what a test round adds to its block is looked up by cell.
   */
  addCell(index: number, round: number, cell: number, isTest: number): void {
    while (index >= this.nextBlockStart) {
      this.block++;
      this.nextBlockStart = firstRoundOfBlock(this.block + 1, this.totalRounds, this.blocks);
    }
    this.cells[isTest * COUNT_CELLS + cell]++;
    const rounds = this.block * 2;
    if (Number.isNaN(this.blockRounds[rounds])) {
      this.blockRounds[rounds] = round;
    }
    this.blockRounds[rounds + 1] = round;
    const stats = this.block * 4;
    const added = BLOCK_ADDS[isTest];
    const at = cell * BLOCK_STATS;
    this.blockStats[stats] += added[at];
    this.blockStats[stats + 1] += added[at + 1];
    this.blockStats[stats + 2] += added[at + 2];
    this.blockStats[stats + 3] += added[at + 3];
  }

  /** Records from log-order index `index` on that still belong to its block. */
  recordsLeftInBlock(index: number): number {
    return this.nextBlockStart - index;
  }

  /**
   * Adds a run of rounds counted elsewhere (the row kernel), all in the current block: counts per
   * cell (generation, then test), the run's first and last round index, what it adds to the block's
   * statistics. Counts are whole numbers, so adding them in another grouping changes nothing.
   */
  addRun(cellCounts: Float64Array, firstRound: number, lastRound: number, blockStats: readonly number[]): void {
    for (let cell = 0; cell < 2 * COUNT_CELLS; cell++) {
      this.cells[cell] += cellCounts[cell];
    }
    const rounds = this.block * 2;
    if (Number.isNaN(this.blockRounds[rounds])) {
      this.blockRounds[rounds] = firstRound;
    }
    this.blockRounds[rounds + 1] = lastRound;
    const stats = this.block * 4;
    for (let stat = 0; stat < BLOCK_STATS; stat++) {
      this.blockStats[stats + stat] += blockStats[stat];
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
