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
  const chosen = selectionSampling(u, remainingTests, remainingTriggers);
  remainingTriggers -= 1;
  remainingTests -= <f64>chosen;
  return chosen;
}

/** 2^−49: scaling by it is exact. */
const TWO_TO_MINUS_49: f64 = 1.7763568394002505e-15;

/**
 * Algorithm S's decision u < n/N (the quotient rounded to a double, as the TypeScript selector
 * computes it), mostly without the division, whose latency would chain each decision to the last:
 * with p = u·N rounded, p(1 + 2^−49) < n proves u < fl(n/N), and p(1 − 2^−49) > n proves the
 * contrary (each rounding errs by a factor 1 ± 2^−53 at most; three of them stay inside the
 * 2^−49 margin). Only between the two, about one decision in 2^47, is the quotient computed.
 * Both bounds depend on u and N alone, so a decision waits for the last one by a comparison.
 */
@inline
function selectionSampling(u: f64, n: f64, triggers: f64): u32 {
  const p = u * triggers;
  const margin = p * TWO_TO_MINUS_49;
  const surelyBelow = <u32>(p + margin < n);
  const surelyAbove = <u32>(p - margin > n);
  if ((surelyBelow | surelyAbove) != 0) return surelyBelow;
  return <u32>(u < n / triggers);
}

/**
 * Reads common rows like `scan` and takes them as the range analysis takes a valid row: the checker's
 * gap count, the test decisions of the triggers missing before it and of its own, the counts and the
 * block's statistics. Stops before a row it cannot take so: a round index not above the last or
 * outside [next round, span's last], the block's end, too few uniform numbers left. Returns where it
 * stopped; the rows taken: `rows()`. The state lives in locals while it runs (a WebAssembly global
 * is a memory access each time, a local a register) and goes back to the globals at the end.
 */
export function step(from: i32, end: i32): i32 {
  const mode = selectionMode;
  const gamma = probability;
  const uniformsHandedIn = uniformCount;
  const spanLast = spanLastRound;
  let used = uniformsUsed;
  let tests = remainingTests;
  let triggers = remainingTriggers;
  let last = lastRound;
  let next = nextRound;
  let blockLeft = recordsLeftInBlock;
  let gapCount = gaps;
  let testCount = testRounds;
  let blockFirst = blockFirstRound;
  let blockLast = blockLastRound;
  let stat0 = blockStat0;
  let stat1 = blockStat1;
  let stat2 = blockStat2;
  let stat3 = blockStat3;
  let taken: i32 = 0;
  let at = from;
  for (;;) {
    // Each row takes a uniform number at least (with a keystream) and a place in the block.
    const uniformsLeft = mode == 2 ? BATCH : uniformsHandedIn - used;
    const limit = <i32>min(<f64>min(uniformsLeft, BATCH), blockLeft);
    if (limit <= 0) break;
    const stop = scan(at, end, limit);
    const n = rowsRead;
    let k: i32 = 0;
    for (; k < n; k++) {
      const round = load<f64>(ROUNDS + (<usize>k << 3));
      if (!(round > last) || round < next || !(round <= spanLast) || blockLeft < 1) break;
      const missing = round - next;
      if (mode != 2 && <f64>(uniformsHandedIn - used) < missing + 1) break;
      const code = <u32>load<u8>(CODES + <usize>k);
      gapCount += round - last - 1;
      last = round;
      blockLeft -= 1;
      if (missing > 0) {
        // Rare: the triggers of missing rounds take their decisions (the globals' way, then back).
        uniformsUsed = used;
        remainingTests = tests;
        remainingTriggers = triggers;
        if (mode == 2) missingTestRounds += missing;
        else for (let j: f64 = 0; j < missing; j++) missingTestRounds += <f64>decide();
        used = uniformsUsed;
        tests = remainingTests;
        triggers = remainingTriggers;
      }
      next = round + 1;
      let isTest: u32;
      if (mode == 2) {
        isTest = code >> 5;
      } else {
        // `decide` on the locals.
        const u = load<f64>(UNIFORMS + (<usize>used << 3));
        used++;
        if (mode == 1) {
          isTest = <u32>(u < gamma);
        } else {
          isTest = selectionSampling(u, tests, triggers);
          triggers -= 1;
          tests -= <f64>isTest;
        }
      }
      testCount += <f64>isTest;
      const cell = code & 31;
      const counted = COUNTS + (<usize>(isTest * <u32>CELLS + cell) << 3);
      store<f64>(counted, load<f64>(counted) + 1);
      if (isNaN(blockFirst)) blockFirst = round;
      blockLast = round;
      if (isTest) {
        const adds = BLOCK_ADDS + (<usize>cell << 5);
        stat0 += load<f64>(adds);
        stat1 += load<f64>(adds, 8);
        stat2 += load<f64>(adds, 16);
        stat3 += load<f64>(adds, 24);
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
  uniformsUsed = used;
  remainingTests = tests;
  remainingTriggers = triggers;
  lastRound = last;
  nextRound = next;
  recordsLeftInBlock = blockLeft;
  gaps = gapCount;
  testRounds = testCount;
  blockFirstRound = blockFirst;
  blockLastRound = blockLast;
  blockStat0 = stat0;
  blockStat1 = stat1;
  blockStat2 = stat2;
  blockStat3 = stat3;
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

// The plain layout `round,x,y,a,b` with 0/1 outcomes and LF line ends, the most common by far, is
// read eight bytes at a time (SWAR: SIMD within a register): the round index's digits, then
// "x,y,a,b\n" checked and decoded in one 64-bit word. A row that does not fit (more than 8 digits,
// CR LF, anything unusual) goes to the general loop below, which gives the same values or refuses.
const ASCII_ZEROS: u64 = 0x3030303030303030;
const HIGH_NIBBLES: u64 = 0xf0f0f0f0f0f0f0f0;
const SIXES: u64 = 0x0606060606060606;
/** "0,0,0,0\n" as a little-endian word: byte 0 is x. */
const PLAIN_TAIL: u64 = 0x0a302c302c302c30;
/** After XOR with PLAIN_TAIL: the separators' bytes (must be 0) and the bits above each value's range. */
const TAIL_SEPARATORS: u64 = 0xff00ff00ff00ff00;
const TAIL_OUT_OF_RANGE: u64 = 0x00fe00fe00fc00fe;

/** Whether the columns are exactly round, x, y, a, b with 0/1 outcomes. */
function isPlainLayout(): bool {
  if (columns != 5 || plusMinus) return false;
  for (let column = 0; column < 5; column++) {
    if (<i32>load<u8>(KINDS + <usize>column) != column + 1) return false;
  }
  return true;
}

/**
 * Reads one row of the plain layout at `p` as row `n` (its round index and code, as `scan` stores
 * them); returns its length in bytes, or 0 when the row is not of the plain shape (nothing stored).
 * Reads up to 17 bytes from `p`; the input's stop byte (0) and the 16 bytes `reserve` keeps after
 * it make every such read land in memory, and a 0 byte never fits a digit, a separator or a value.
 */
@inline
function plainRow(p: usize, n: i32): usize {
  const word = load<u64>(p);
  // A byte is a digit when its high nibble is 3 before and after adding 6; carries and borrows
  // start only at a byte that is not, so the bytes before the first non-digit read true.
  const notDigits = ((word & HIGH_NIBBLES) ^ ASCII_ZEROS) | (((word + SIXES) & HIGH_NIBBLES) ^ ASCII_ZEROS);
  const digits = <usize>(ctz<u64>(notDigits) >> 3);
  if (digits == 0 || <u32>load<u8>(p + digits) != COMMA) return 0;
  const tail = load<u64>(p + digits + 1) ^ PLAIN_TAIL;
  if ((tail & (TAIL_SEPARATORS | TAIL_OUT_OF_RANGE)) != 0) return 0;
  const x = <u32>tail & 0xff;
  const y = <u32>(tail >> 16) & 0xff;
  const a = <u32>(tail >> 32) & 0xff;
  const b = <u32>(tail >> 48) & 0xff;
  if (y == 3) return 0;
  store<f64>(ROUNDS + (<usize>n << 3), <f64>eightDigits((word - ASCII_ZEROS) << ((8 - <u64>digits) << 3)));
  store<u8>(CODES + <usize>n, <u8>(((x * 3 + y) * 2 + a) * 2 + b));
  return digits + 9;
}

/**
 * The number written by eight decimal digits, one a byte (values 0–9), the first digit in the lowest
 * byte: pairs, then fours, then all eight, with three multiplications (the SWAR parsing described in
 * Lemire, "Fast Number Parsing", and in simdjson's parse_eight_digits_unrolled).
 */
@inline
function eightDigits(digits: u64): u64 {
  const pairs = (digits * 10 + (digits >> 8)) & 0x00ff00ff00ff00ff;
  const fours = ((pairs * (1 + (100 << 16))) >> 16) & 0x0000ffff0000ffff;
  return (fours * (1 + (<u64>10000 << 32))) >> 32;
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
  const plain = isPlainLayout();
  let n: i32 = 0;
  const most = min(limit, BATCH);
  while (n < most) {
    const start = p;
    if (plain) {
      const taken = plainRow(p, n);
      if (taken != 0) {
        p += taken;
        n++;
        continue;
      }
    }
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
