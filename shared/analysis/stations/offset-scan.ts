import { chshValue, correlator } from '../statistics/chsh-value';
import { RowCursor } from './row-cursor';
import { StationBatch } from './station-batch';

/** How far the scan looks on either side of its centre, in rounds. */
export const OFFSET_REACH = 16;

/** Station A's records the scan reads by default. */
export const ALIGNMENT_WINDOW_ROUNDS = 1_000_000;

/**
 * Ring slots per station: a power of two above OFFSET_REACH + 1, the rows one round may pair with.
 * A round's slot is `round & RING_MASK`: the bitwise AND takes the integer modulo 2^32 first, which
 * keeps the low five bits of every safe integer, negative ones included (two's complement).
 */
const RING = 32;
const RING_MASK = RING - 1;

/** The CHSH figures of one pairing: station A's round r with station B's round r + offset. */
export interface OffsetFit {
  /** k: A's round r paired with B's round r + k. */
  offset: number;
  /** CHSH rounds (x, y ∈ {0, 1}) so paired, per setting pair: [m00, m01, m10, m11]. */
  settingPairRounds: number[];
  /** The correlators E_xy = (N_same − N_diff)/(N_same + N_diff), null for a pair without rounds. */
  correlators: { E00: number | null; E01: number | null; E10: number | null; E11: number | null };
  /** S = E00 + E01 + E10 − E11 (the engine's convention, `chshValue`); null when a pair has no rounds. */
  chshValue: number | null;
}

/** The CHSH value of every pairing within reach of the centre. */
export interface OffsetScan {
  /** The offset the scan is centred on: the stated offset, or 0. */
  centre: number;
  /** Station A's records read (at most the window). */
  roundsRead: number;
  /** The window asked for, in station A's records. */
  windowRounds: number;
  /** One fit per offset, centre − OFFSET_REACH … centre + OFFSET_REACH, in increasing order. */
  fits: OffsetFit[];
}

/** Where the scan is centred and how much it reads. */
export interface OffsetScanOptions {
  /** The offset to centre on (a stated offset); default 0. */
  centre?: number;
  /** Station A's records to read; default `ALIGNMENT_WINDOW_ROUNDS`. */
  windowRounds?: number;
}

/**
 * Pairs station A's first `windowRounds` records with station B's records shifted by every offset
 * k within `OFFSET_REACH` of the centre (A's round r with B's round r + k, by round index, so gaps
 * shift nothing) and tallies the CHSH correlators of each pairing, in one streaming pass over both
 * records that holds the last OFFSET_REACH + 1 rows of each. Reports; applies nothing.
 */
export async function scanOffsets(recordA: AsyncIterable<StationBatch>, recordB: AsyncIterable<StationBatch>, options: OffsetScanOptions = {}): Promise<OffsetScan> {
  const centre = options.centre ?? 0;
  const windowRounds = options.windowRounds ?? ALIGNMENT_WINDOW_ROUNDS;
  if (!Number.isSafeInteger(centre) || !Number.isSafeInteger(windowRounds) || windowRounds < 1) {
    throw new RangeError(`an offset scan needs a whole centre and at least one round, not ${centre} and ${windowRounds}`);
  }
  const tally = new OffsetTally();
  const a = new RowCursor(recordA);
  const b = new RowCursor(recordB);
  let roundsRead = 0;
  let windowRead = false;
  try {
    for (;;) {
      const aReady: boolean = !windowRead && (a.hasRow || (await a.refill()));
      windowRead ||= !aReady;
      const bReady = b.hasRow || (await b.refill());
      if (aReady && bReady && !windowRead) {
        roundsRead = tally.mergeWhileBoth(a, b, centre, roundsRead, windowRounds);
        windowRead = roundsRead === windowRounds;
        continue;
      }
      if (aReady && (!bReady || a.round <= b.round - centre)) {
        tally.addA(a.batch, a.at);
        a.at++;
        windowRead = ++roundsRead === windowRounds;
        continue;
      }
      // Past A's window only the B rows that can still meet one of its rows are read.
      const last = tally.lastRoundA;
      if (!bReady || (windowRead && (last === null || b.round - centre > last + OFFSET_REACH))) {
        break;
      }
      tally.addB(b.batch, b.at, b.round - centre);
      b.at++;
    }
  } finally {
    await Promise.all([a.close(), b.close()]);
  }
  return { centre, roundsRead, windowRounds, fits: tally.fits(centre) };
}

/** A row's settings and outcome as one code: setting·2 + outcome (A: 0 … 3; B: 0 … 5, y = 2 included and left out at the end). */
const CODES_A = 4;
const CODES_B = 6;
const CELLS = CODES_A * CODES_B;

/**
 * The counts of every pairing: for each offset, rounds by A's code and B's code, from which the
 * CHSH rounds with equal and with unequal outcomes per setting pair are read at the end. Rows arrive
 * in merge order (A before B at the same centred round), so each pair of rows is counted once: an A
 * row meets the B rows before it (offsets −REACH … −1), a B row the A rows up to its own round
 * (offsets 0 … +REACH).
 */
class OffsetTally {
  /** Index (offset + REACH)·CELLS + codeA·CODES_B + codeB. */
  private readonly counts = new Float64Array((2 * OFFSET_REACH + 1) * CELLS);
  private readonly roundsA = new Float64Array(RING).fill(NaN);
  private readonly codesA = new Uint8Array(RING);
  private readonly roundsB = new Float64Array(RING).fill(NaN);
  private readonly codesB = new Uint8Array(RING);
  /** The last A round taken. */
  lastRoundA: number | null = null;

  /**
   * Takes rows in merge order while both cursors have rows at hand and A's window is not read: the
   * per-row path without a wait. Returns A's rows read so far.
   */
  mergeWhileBoth(a: RowCursor, b: RowCursor, centre: number, roundsRead: number, windowRounds: number): number {
    const rowsA = a.batch;
    const rowsB = b.batch;
    let i = a.at;
    let j = b.at;
    let read = roundsRead;
    while (i < rowsA.length && j < rowsB.length && read < windowRounds) {
      const s = rowsB.round[j] - centre;
      if (rowsA.round[i] <= s) {
        this.addA(rowsA, i++);
        read++;
      } else {
        this.addB(rowsB, j++, s);
      }
    }
    a.at = i;
    b.at = j;
    return read;
  }

  /** Row `i` of a batch of A's. */
  addA(rows: StationBatch, i: number): void {
    const { counts, roundsB, codesB } = this;
    const r = rows.round[i];
    const code = rows.setting[i] * 2 + rows.outcome[i];
    const slot = r & RING_MASK;
    this.roundsA[slot] = r;
    this.codesA[slot] = code;
    this.lastRoundA = r;
    const row = code * CODES_B;
    for (let back = 1; back <= OFFSET_REACH; back++) {
      const other = (r - back) & RING_MASK;
      if (roundsB[other] === r - back) counts[(OFFSET_REACH - back) * CELLS + row + codesB[other]]++;
    }
  }

  /** Row `j` of a batch of B's, at centred round `s`. */
  addB(rows: StationBatch, j: number, s: number): void {
    const { counts, roundsA, codesA } = this;
    const code = rows.setting[j] * 2 + rows.outcome[j];
    const slot = s & RING_MASK;
    this.roundsB[slot] = s;
    this.codesB[slot] = code;
    for (let back = 0; back <= OFFSET_REACH; back++) {
      const other = (s - back) & RING_MASK;
      if (roundsA[other] === s - back) counts[(OFFSET_REACH + back) * CELLS + codesA[other] * CODES_B + code]++;
    }
  }

  /** Rounds at offset index `index` with settings (x, y), equal (`same`) or unequal outcomes. */
  private rounds(index: number, x: number, y: number, same: boolean): number {
    let total = 0;
    for (const a of [0, 1]) {
      const b = same ? a : 1 - a;
      total += this.counts[index * CELLS + (x * 2 + a) * CODES_B + y * 2 + b];
    }
    return total;
  }

  fits(centre: number): OffsetFit[] {
    return Array.from({ length: 2 * OFFSET_REACH + 1 }, (_, index) => {
      const settingPairs = [0, 1, 2, 3].map((pair) => ({ x: pair >> 1, y: pair & 1 }));
      const same = settingPairs.map(({ x, y }) => this.rounds(index, x, y, true));
      const different = settingPairs.map(({ x, y }) => this.rounds(index, x, y, false));
      const [E00, E01, E10, E11] = [0, 1, 2, 3].map((pair) => correlator(same[pair], different[pair]));
      const value = E00 === null || E01 === null || E10 === null || E11 === null ? null : chshValue(E00, E01, E10, E11);
      return {
        offset: centre + index - OFFSET_REACH,
        settingPairRounds: [0, 1, 2, 3].map((pair) => same[pair] + different[pair]),
        correlators: { E00, E01, E10, E11 },
        chshValue: value,
      };
    });
  }
}
