// The line count (AssemblyScript, compiled to WebAssembly by `node server/cli/run-compiled.js --build`
// into dist/server/line-count.wasm): the line breaks of a piece of text and how many of them end a
// blank line, 16 bytes a step with WebAssembly's SIMD. The counting pass and the upload's census
// count every byte of a log this way; shared/analysis/node/wasm-line-counter.ts keeps the state
// across pieces, and shared/analysis/log/line-counter.ts is the rule it must give the same counts as.
//
// A line ending at the LF at i is blank when nothing, or only the CR of a CRLF, stands between it
// and the line break before (or the start of the text): byte i−1 is LF, or byte i−1 is CR and byte
// i−2 is LF. The caller writes the two bytes before the piece at INPUT−2 and INPUT−1 (LF LF at the
// start of the text, which begins a line), so every test reads bytes of the memory.
//
// Memory: the piece from INPUT on; static data, if the compiler makes any, below it (asc
// --memoryBase 1024).

/** Room after the piece for the last step's loads. */
const CONTEXT: usize = 16;
const INPUT: usize = 65536;

const LF: u8 = 10;
const CR: u8 = 13;

/** Line breaks in the last piece counted. */
export let breaks: i32 = 0;
/** Of them, those that end a blank line. */
export let blanks: i32 = 0;

/** Where the piece goes; its two bytes of context just before. */
export function inputAt(): usize {
  return INPUT;
}

/** Grows the memory so that a piece of `bytes` bytes fits; false if it cannot. */
export function reserve(bytes: i32): bool {
  const needed = INPUT + <usize>bytes + CONTEXT;
  const have = <usize>memory.size() << 16;
  if (needed <= have) return true;
  return memory.grow(<i32>((needed - have + 65535) >> 16)) >= 0;
}

/** Counts the line breaks of the `length` bytes at INPUT, and the blank lines they end. */
export function count(length: i32): void {
  const lf = i8x16.splat(LF);
  const cr = i8x16.splat(CR);
  let lineBreaks: i32 = 0;
  let blankLines: i32 = 0;
  const whole = INPUT + (<usize>length & ~(<usize>15));
  let at = INPUT;
  for (; at < whole; at += 16) {
    const bytes = v128.load(at);
    const before = v128.load(at - 1);
    const twoBefore = v128.load(at - 2);
    const isBreak = i8x16.eq(bytes, lf);
    const afterBreak = i8x16.eq(before, lf);
    const afterLoneCr = v128.and(i8x16.eq(before, cr), i8x16.eq(twoBefore, lf));
    lineBreaks += popcnt<i32>(i8x16.bitmask(isBreak));
    blankLines += popcnt<i32>(i8x16.bitmask(v128.and(isBreak, v128.or(afterBreak, afterLoneCr))));
  }
  for (const end = INPUT + <usize>length; at < end; at++) {
    if (load<u8>(at) != LF) continue;
    lineBreaks++;
    const before = load<u8>(at - 1);
    if (before == LF || (before == CR && load<u8>(at - 2) == LF)) blankLines++;
  }
  breaks = lineBreaks;
  blanks = blankLines;
}
