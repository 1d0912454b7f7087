// The row kernel (AssemblyScript, compiled to WebAssembly by `node server/cli/run-compiled.js --build`
// into dist/wasm/row-kernel.wasm). It reads the common rows of a round log, and only those: every
// field a plain integer in range, the header's field count, a line break (LF or CR LF) at the end.
// It stops at the first other line (a quote, a sign or digit it does not expect, a blank or
// over-long line, the end of the bytes), which the TypeScript byte scanner then reads as before,
// with its messages. So a row the kernel reads gives exactly the values the scanner would give.
//
// With `step`, it also takes each row's test decision and counts it (the range analysis's common
// case), stopping where that needs the TypeScript: a round index that does not follow, a stationarity
// block's end, the uniform numbers handed in used up.
//
// Memory: the column kinds from 0, the rows read (round index as f64, then a code per row) from
// ROUNDS, the step's uniform numbers and counts below INPUT, the bytes to read from INPUT (the
// caller grows the memory to fit, see `reserve`). Static data starts above INPUT (asc
// --memoryBase), so nothing else lives in these areas.

/** Rows read per call at most. */
export const BATCH: i32 = 8192;
const KINDS: usize = 0;
const MAX_COLUMNS: i32 = 1024;
const ROUNDS: usize = 1024;
const CODES: usize = ROUNDS + <usize>BATCH * 8;
const UNIFORMS: usize = CODES + <usize>BATCH;
/** Count cells per table, and what a test round adds to its block's statistics, 4 numbers per cell. */
const CELLS: i32 = 24;
const COUNTS: usize = UNIFORMS + <usize>BATCH * 8;
const BLOCK_ADDS: usize = COUNTS + <usize>(2 * CELLS) * 8;
const INPUT: usize = 262144;
/** A longer line is left to the scanner (its own limit, much larger, names it as too long). */
const LONGEST_ROW: usize = 65536;

// Column kinds: what the column holds.
const EXTRA: u8 = 0;
const ROUND: u8 = 1;
const X: u8 = 2;
const Y: u8 = 3;
const A: u8 = 4;
const B: u8 = 5;
const TEST: u8 = 6;

const LF: u32 = 10;
const CR: u32 = 13;
const COMMA: u32 = 44;
const QUOTE: u32 = 34;
const MINUS: u32 = 45;
const DIGIT_0: u32 = 48;
const DIGIT_1: u32 = 49;
/** Digits of a round index at most: 15 digits stay below 2^53, so the f64 is exact. */
const ROUND_DIGITS: usize = 15;

let columns: i32 = 0;
let plusMinus: bool = false;
let rowsRead: i32 = 0;

/** Where the rows' round indices and codes are written, and where the input goes. */
export function roundsAt(): usize {
  return ROUNDS;
}
export function codesAt(): usize {
  return CODES;
}
export function inputAt(): usize {
  return INPUT;
}

/** Sets the row shape: `columnCount` columns, outcomes written as ±1 or not. Kinds via `setColumn`. */
export function configure(columnCount: i32, outcomesPlusMinus: bool): bool {
  if (columnCount < 1 || columnCount > MAX_COLUMNS) return false;
  columns = columnCount;
  plusMinus = outcomesPlusMinus;
  memory.fill(KINDS, EXTRA, <usize>columnCount);
  return true;
}

export function setColumn(column: i32, kind: u8): void {
  store<u8>(KINDS + <usize>column, kind);
}

/** Grows the memory so that `bytes` of input (and a stop byte after them) fit; false if it cannot. */
export function reserve(bytes: i32): bool {
  const needed = INPUT + <usize>bytes + 16;
  const have = <usize>memory.size() << 16;
  if (needed <= have) return true;
  return memory.grow(<i32>((needed - have + 65535) >> 16)) >= 0;
}

// The step's state: the selection, the record checker's and the block's, set before `step` and read after.
/** 0 fixed-fraction, 1 Bernoulli, 2 the log's marking. */
let selectionMode: i32 = 0;
export let remainingTests: f64 = 0;
export let remainingTriggers: f64 = 0;
let probability: f64 = 0;
/** Uniform numbers handed in (at UNIFORMS), and how many the step used. */
let uniformCount: i32 = 0;
export let uniformsUsed: i32 = 0;
export let lastRound: f64 = 0;
export let nextRound: f64 = 0;
let spanLastRound: f64 = 0;
/** Records the step may still take before the block ends. */
let recordsLeftInBlock: f64 = 0;
// What the step adds: counts per cell at COUNTS (generation, then test), and these.
export let gaps: f64 = 0;
export let missingTestRounds: f64 = 0;
export let testRounds: f64 = 0;
export let blockFirstRound: f64 = NaN;
export let blockLastRound: f64 = 0;
export let blockStat0: f64 = 0;
export let blockStat1: f64 = 0;
export let blockStat2: f64 = 0;
export let blockStat3: f64 = 0;

export function countsAt(): usize {
  return COUNTS;
}
export function blockAddsAt(): usize {
  return BLOCK_ADDS;
}
export function uniformsAt(): usize {
  return UNIFORMS;
}

/** The state a step starts from (the additions start from zero). */
export function startStep(mode: i32, tests: f64, triggers: f64, p: f64, uniforms: i32, last: f64, next: f64, spanLast: f64, blockRecords: f64): void {
  selectionMode = mode;
  remainingTests = tests;
  remainingTriggers = triggers;
  probability = p;
  uniformCount = uniforms;
  uniformsUsed = 0;
  lastRound = last;
  nextRound = next;
  spanLastRound = spanLast;
  recordsLeftInBlock = blockRecords;
  gaps = 0;
  missingTestRounds = 0;
  testRounds = 0;
  blockFirstRound = NaN;
  blockLastRound = 0;
  blockStat0 = 0;
  blockStat1 = 0;
  blockStat2 = 0;
  blockStat3 = 0;
  memory.fill(COUNTS, 0, <usize>(2 * CELLS) * 8);
}

/** The next trigger's decision, 1 or 0, from the next uniform number (the caller checked there is one). */
@inline
function decide(): u32 {
  const u = load<f64>(UNIFORMS + (<usize>uniformsUsed << 3));
  uniformsUsed++;
  if (selectionMode == 1) return <u32>(u < probability);
  const chosen = <u32>(u < remainingTests / remainingTriggers);
  remainingTriggers -= 1;
  remainingTests -= <f64>chosen;
  return chosen;
}

/**
 * Reads common rows like `scan` and takes them as the range analysis takes a valid row: the checker's
 * gap count, the test decisions of the triggers missing before it and of its own, the counts and the
 * block's statistics. Stops before a row it cannot take so: a round index not above the last or
 * outside [next round, span's last], the block's end, too few uniform numbers left. Returns where it
 * stopped; the rows taken: `rows()`.
 */
export function step(from: i32, end: i32): i32 {
  let taken: i32 = 0;
  let at = from;
  for (;;) {
    // Each row takes a uniform number at least (with a keystream) and a place in the block.
    const uniformsLeft = selectionMode == 2 ? BATCH : uniformCount - uniformsUsed;
    const limit = <i32>min(<f64>min(uniformsLeft, BATCH), recordsLeftInBlock);
    if (limit <= 0) break;
    const stop = scan(at, end, limit);
    const n = rowsRead;
    let k: i32 = 0;
    for (; k < n; k++) {
      const round = load<f64>(ROUNDS + (<usize>k << 3));
      if (!(round > lastRound) || round < nextRound || !(round <= spanLastRound) || recordsLeftInBlock < 1) break;
      const missing = round - nextRound;
      if (selectionMode != 2 && <f64>(uniformCount - uniformsUsed) < missing + 1) break;
      const code = <u32>load<u8>(CODES + <usize>k);
      gaps += round - lastRound - 1;
      lastRound = round;
      recordsLeftInBlock -= 1;
      if (selectionMode == 2) {
        missingTestRounds += missing;
      } else {
        for (let j: f64 = 0; j < missing; j++) missingTestRounds += <f64>decide();
      }
      nextRound = round + 1;
      const isTest: u32 = selectionMode == 2 ? code >> 5 : decide();
      testRounds += <f64>isTest;
      const cell = code & 31;
      const counted = COUNTS + ((<usize>(isTest * <u32>CELLS + cell)) << 3);
      store<f64>(counted, load<f64>(counted) + 1);
      if (isNaN(blockFirstRound)) blockFirstRound = round;
      blockLastRound = round;
      if (isTest) {
        const adds = BLOCK_ADDS + (<usize>cell << 5);
        blockStat0 += load<f64>(adds);
        blockStat1 += load<f64>(adds, 8);
        blockStat2 += load<f64>(adds, 16);
        blockStat3 += load<f64>(adds, 24);
      }
    }
    taken += k;
    if (k < n) {
      // Back to the start of the first row not taken: the line after the k rows taken.
      at = lineStartAfter(at, k);
      break;
    }
    at = stop;
    if (n < limit) break;
  }
  rowsRead = taken;
  return at;
}

/** The offset after `lines` line breaks from `from` (the rows a scan read there). */
function lineStartAfter(from: i32, lines: i32): i32 {
  let p: usize = INPUT + <usize>from;
  for (let seen = 0; seen < lines; p++) {
    if (load<u8>(p) == <u8>LF) seen++;
  }
  return <i32>(p - INPUT);
}

/** Rows read by the last `scan`. */
export function rows(): i32 {
  return rowsRead;
}

/**
 * Reads common rows of the input from offset `from`, up to `limit` (at most BATCH); `end` is the input's
 * length, and the byte at `end` must be 0 (the caller writes it), so a row running into the end
 * stops there. Returns the offset after the last row read: the start of the line it stopped at.
 * Each row gives its round index (f64 at ROUNDS) and a code (u8 at CODES): the count cell
 * ((x·3 + y)·2 + a)·2 + b in bits 0–4, the test marking in bit 5.
 */
export function scan(from: i32, end: i32, limit: i32): i32 {
  let p: usize = INPUT + <usize>from;
  const columnCount = columns;
  const pm = plusMinus;
  let n: i32 = 0;
  const most = min(limit, BATCH);
  while (n < most) {
    const start = p;
    let round: u64 = 0;
    let x: u32 = 0;
    let y: u32 = 0;
    let a: u32 = 0;
    let b: u32 = 0;
    let t: u32 = 0;
    let ok = true;
    for (let column = 0; column < columnCount; column++) {
      const kind = load<u8>(KINDS + <usize>column);
      let c = <u32>load<u8>(p);
      if (kind == ROUND) {
        const first = p;
        while (c - DIGIT_0 < 10) {
          round = round * 10 + <u64>(c - DIGIT_0);
          c = <u32>load<u8>(++p);
        }
        if (p == first || p - first > ROUND_DIGITS) {
          ok = false;
          break;
        }
      } else if (kind == EXTRA) {
        while (c != COMMA && c != LF && c != CR && c != QUOTE && c != 0) {
          c = <u32>load<u8>(++p);
        }
        if (c == QUOTE || c == 0 || p - start > LONGEST_ROW) {
          ok = false;
          break;
        }
      } else {
        let value: u32;
        if (pm && (kind == A || kind == B)) {
          // +1 is written "1" and read as 0, −1 is written "-1" and read as 1.
          const negative = c == MINUS;
          if (negative) c = <u32>load<u8>(++p);
          if (c != DIGIT_1) {
            ok = false;
            break;
          }
          value = <u32>negative;
        } else {
          value = c - DIGIT_0;
          if (value > (kind == Y ? 2 : 1)) {
            ok = false;
            break;
          }
        }
        c = <u32>load<u8>(++p);
        if (kind == X) x = value;
        else if (kind == Y) y = value;
        else if (kind == A) a = value;
        else if (kind == B) b = value;
        else t = value;
      }
      // The separator: a comma between fields, a line break after the last.
      if (column + 1 < columnCount) {
        if (c != COMMA) {
          ok = false;
          break;
        }
        p++;
      } else if (c == LF) {
        p++;
      } else if (c == CR && <u32>load<u8>(p + 1) == LF) {
        p += 2;
      } else {
        ok = false;
        break;
      }
    }
    if (!ok) {
      p = start;
      break;
    }
    store<f64>(ROUNDS + (<usize>n << 3), <f64>round);
    store<u8>(CODES + <usize>n, <u8>((((x * 3 + y) * 2 + a) * 2 + b) | (t << 5)));
    n++;
  }
  rowsRead = n;
  return <i32>(p - INPUT);
}
