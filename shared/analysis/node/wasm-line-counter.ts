import { LineCounter, LineCounting, LineTally } from '../log/line-counter';
import { instantiate, wasmModule } from './wasm-modules';

/** The line count's exports (see wasm/line-count.ts). */
interface LineCountExports {
  memory: { buffer: ArrayBuffer };
  inputAt(): number;
  reserve(bytes: number): number;
  count(length: number): void;
  breaks: { value: number };
  blanks: { value: number };
}

const LF = 10;
/** Text counted per call at most: the pieces of a longer chunk go one after the other. */
const PIECE_BYTES = 1 << 20;

let shared: LineCountExports | null | undefined;

/** This thread's instance of the line count (counters keep their state here, so one serves them all), or null without the build. */
function lineCount(): LineCountExports | null {
  if (shared === undefined) {
    const module = wasmModule('line-count');
    shared = module === null ? null : instantiate<LineCountExports>(module);
    if (shared !== null && !shared.reserve(PIECE_BYTES)) shared = null;
  }
  return shared;
}

/**
 * The line counter's rule (log/line-counter.ts) with the line breaks and blank lines counted 16
 * bytes a step in WebAssembly: each piece is copied into the module's memory behind the two bytes
 * of text before it, which decide whether its first line breaks end blank lines.
 */
class WasmLineCounter extends LineTally {
  /** The last two bytes of the text so far; before the text, two line breaks (it begins a line). */
  private beforeLast = LF;
  private last = LF;

  constructor(private readonly exports: LineCountExports) {
    super();
  }

  push(chunk: Uint8Array): void {
    for (let from = 0; from < chunk.length; from += PIECE_BYTES) {
      this.pushPiece(chunk.subarray(from, Math.min(from + PIECE_BYTES, chunk.length)));
    }
  }

  private pushPiece(piece: Uint8Array): void {
    const exports = this.exports;
    const at = exports.inputAt();
    const memory = new Uint8Array(exports.memory.buffer, at - 2, piece.length + 2);
    memory[0] = this.beforeLast;
    memory[1] = this.last;
    memory.set(piece, 2);
    exports.count(piece.length);
    const breaks = exports.breaks.value;
    this.lines += breaks;
    this.records += breaks - exports.blanks.value;
    const lastBreak = breaks === 0 ? -1 : piece.lastIndexOf(LF);
    this.pending = lastBreak < 0 ? this.pending + piece.length : piece.length - lastBreak - 1;
    this.beforeLast = piece.length > 1 ? piece[piece.length - 2] : this.last;
    this.last = piece[piece.length - 1];
  }
}

/** A line counter: in WebAssembly where the build made it, else the TypeScript rule. */
export function createLineCounter(): LineCounting {
  const exports = lineCount();
  return exports === null ? new LineCounter() : new WasmLineCounter(exports);
}
