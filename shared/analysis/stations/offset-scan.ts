import { chshValue, correlator } from '../statistics/chsh-value';
import { RowCursor } from './row-cursor';
import { StationRow } from './station-row';

/** How far the scan looks on either side of its centre, in rounds. */
export const OFFSET_REACH = 16;

/** Station A's records the scan reads by default. */
export const ALIGNMENT_WINDOW_ROUNDS = 1_000_000;

/** The four CHSH setting pairs, in the order of `settingPairRounds`: (x, y) = 00, 01, 10, 11. */
const PAIRS = 4;
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
export async function scanOffsets(
  recordA: AsyncIterable<readonly StationRow[]>,
  recordB: AsyncIterable<readonly StationRow[]>,
  options: OffsetScanOptions = {},
): Promise<OffsetScan> {
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
      if (aReady && (!bReady || a.row.round <= b.row.round - centre)) {
        tally.addA(a.row);
        a.advance();
        windowRead = ++roundsRead === windowRounds;
        continue;
      }
      // Past A's window only the B rows that can still meet one of its rows are read.
      const last = tally.lastRoundA;
      if (!bReady || (windowRead && (last === null || b.row.round - centre > last + OFFSET_REACH))) {
        break;
      }
      tally.addB(b.row, b.row.round - centre);
      b.advance();
    }
  } finally {
    await Promise.all([a.close(), b.close()]);
  }
  return { centre, roundsRead, windowRounds, fits: tally.fits(centre) };
}

/**
 * The counts of every pairing: for each offset and setting pair, rounds with equal and with unequal
 * outcomes. Rows arrive in merge order (A before B at the same centred round), so each pair of rows
 * is counted once: an A row meets the B rows before it (offsets −REACH … −1), a B row the A rows up to
 * its own round (offsets 0 … +REACH).
 */
class OffsetTally {
  /** Index (offset + REACH)·8 + pair·2 + (0 same, 1 different). */
  private readonly counts = new Float64Array((2 * OFFSET_REACH + 1) * PAIRS * 2);
  private readonly roundsA = new Float64Array(RING).fill(NaN);
  private readonly settingsA = new Uint8Array(RING);
  private readonly outcomesA = new Uint8Array(RING);
  private readonly roundsB = new Float64Array(RING).fill(NaN);
  private readonly settingsB = new Uint8Array(RING);
  private readonly outcomesB = new Uint8Array(RING);
  /** The last A round taken. */
  lastRoundA: number | null = null;

  addA(row: StationRow): void {
    const r = row.round;
    const slot = r & RING_MASK;
    this.roundsA[slot] = r;
    this.settingsA[slot] = row.setting;
    this.outcomesA[slot] = row.outcome;
    this.lastRoundA = r;
    for (let back = 1; back <= OFFSET_REACH; back++) {
      const s = r - back;
      const other = s & RING_MASK;
      if (this.roundsB[other] === s) {
        this.count(-back, row.setting, row.outcome, this.settingsB[other], this.outcomesB[other]);
      }
    }
  }

  /** A row of B at centred round `s`. */
  addB(row: StationRow, s: number): void {
    const slot = s & RING_MASK;
    this.roundsB[slot] = s;
    this.settingsB[slot] = row.setting;
    this.outcomesB[slot] = row.outcome;
    for (let back = 0; back <= OFFSET_REACH; back++) {
      const r = s - back;
      const other = r & RING_MASK;
      if (this.roundsA[other] === r) {
        this.count(back, this.settingsA[other], this.outcomesA[other], row.setting, row.outcome);
      }
    }
  }

  private count(offset: number, x: number, a: number, y: number, b: number): void {
    if (y < 2) {
      this.counts[((offset + OFFSET_REACH) * PAIRS + x * 2 + y) * 2 + (a === b ? 0 : 1)]++;
    }
  }

  fits(centre: number): OffsetFit[] {
    return Array.from({ length: 2 * OFFSET_REACH + 1 }, (_, index) => {
      const at = index * PAIRS * 2;
      const same = (pair: number) => this.counts[at + pair * 2];
      const different = (pair: number) => this.counts[at + pair * 2 + 1];
      const [E00, E01, E10, E11] = [0, 1, 2, 3].map((pair) => correlator(same(pair), different(pair)));
      const value = E00 === null || E01 === null || E10 === null || E11 === null ? null : chshValue(E00, E01, E10, E11);
      return {
        offset: centre + index - OFFSET_REACH,
        settingPairRounds: [0, 1, 2, 3].map((pair) => same(pair) + different(pair)),
        correlators: { E00, E01, E10, E11 },
        chshValue: value,
      };
    });
  }
}
