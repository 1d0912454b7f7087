import { HeaderLayout } from '../log/header-layout';
import { KernelStep, KernelStepStart, RowKernel } from '../log/row-kernel';
import { TEST_ROUND_BLOCK_ADDS } from '../tally/round-tally';
import { instantiate, wasmModule } from './wasm-modules';

/** The kernel's exports (see wasm/row-kernel.ts). */
interface KernelExports {
  memory: { buffer: ArrayBuffer };
  BATCH: { value: number };
  roundsAt(): number;
  codesAt(): number;
  inputAt(): number;
  configure(columnCount: number, outcomesPlusMinus: number): number;
  setColumn(column: number, kind: number): void;
  reserve(bytes: number): number;
  countsAt(): number;
  blockAddsAt(): number;
  uniformsAt(): number;
  rows(): number;
  scan(from: number, end: number, limit: number): number;
  startStep(mode: number, tests: number, triggers: number, probability: number, uniforms: number, last: number, next: number, spanLast: number, blockRecords: number): void;
  step(from: number, end: number): number;
  remainingTests: { value: number };
  remainingTriggers: { value: number };
  uniformsUsed: { value: number };
  lastRound: { value: number };
  nextRound: { value: number };
  gaps: { value: number };
  missingTestRounds: { value: number };
  testRounds: { value: number };
  blockFirstRound: { value: number };
  blockLastRound: { value: number };
  blockStat0: { value: number };
  blockStat1: { value: number };
  blockStat2: { value: number };
  blockStat3: { value: number };
}

/** Cells of the two count tables (generation, test). */
const TALLY_CELLS = 48;

/** The row kernel in WebAssembly. */
class WasmRowKernel implements RowKernel {
  rounds: Float64Array;
  codes: Uint8Array;
  private cellCounts: Float64Array;
  private uniforms: Float64Array;
  private loadedBytes = 0;

  constructor(private readonly kernel: KernelExports) {
    this.rounds = new Float64Array(0);
    this.codes = new Uint8Array(0);
    this.cellCounts = new Float64Array(0);
    this.uniforms = new Float64Array(0);
    this.view();
    new Float64Array(kernel.memory.buffer, kernel.blockAddsAt(), TEST_ROUND_BLOCK_ADDS.length).set(TEST_ROUND_BLOCK_ADDS);
  }

  get rowCount(): number {
    return this.kernel.rows();
  }

  load(bytes: Uint8Array): void {
    if (!this.kernel.reserve(bytes.length)) {
      throw new Error(`the row kernel cannot hold ${bytes.length} bytes`);
    }
    this.view();
    const input = new Uint8Array(this.kernel.memory.buffer, this.kernel.inputAt(), bytes.length + 1);
    input.set(bytes);
    // The stop byte: no row runs past it.
    input[bytes.length] = 0;
    this.loadedBytes = bytes.length;
  }

  read(from: number, limit: number): number {
    return this.kernel.scan(from, this.loadedBytes, limit);
  }

  step(from: number, start: KernelStepStart): KernelStep {
    const kernel = this.kernel;
    const { selection } = start;
    const uniforms = Math.min(selection.uniforms.length, this.uniforms.length);
    this.uniforms.set(selection.uniforms.subarray(0, uniforms));
    kernel.startStep(
      selection.mode,
      selection.remainingTests,
      selection.remainingTriggers,
      selection.probability,
      uniforms,
      start.lastRound,
      start.nextRound,
      start.spanLastRound,
      start.recordsLeftInBlock,
    );
    const stop = kernel.step(from, this.loadedBytes);
    return {
      stop,
      uniformsUsed: kernel.uniformsUsed.value,
      remainingTests: kernel.remainingTests.value,
      remainingTriggers: kernel.remainingTriggers.value,
      lastRound: kernel.lastRound.value,
      nextRound: kernel.nextRound.value,
      gaps: kernel.gaps.value,
      missingTestRounds: kernel.missingTestRounds.value,
      testRounds: kernel.testRounds.value,
      cellCounts: this.cellCounts,
      blockFirstRound: kernel.blockFirstRound.value,
      blockLastRound: kernel.blockLastRound.value,
      blockStats: [kernel.blockStat0.value, kernel.blockStat1.value, kernel.blockStat2.value, kernel.blockStat3.value],
    };
  }

  /** Views of the output areas, made again when the memory has grown (its old buffer is gone). */
  private view(): void {
    const buffer = this.kernel.memory.buffer;
    if (this.rounds.buffer !== buffer) {
      const batch = this.kernel.BATCH.value;
      this.rounds = new Float64Array(buffer, this.kernel.roundsAt(), batch);
      this.codes = new Uint8Array(buffer, this.kernel.codesAt(), batch);
      this.cellCounts = new Float64Array(buffer, this.kernel.countsAt(), TALLY_CELLS);
      this.uniforms = new Float64Array(buffer, this.kernel.uniformsAt(), batch);
    }
  }
}

/** A row kernel for logs of this header, or null when there is no kernel (or the header is too wide for it). */
export function createRowKernel(layout: HeaderLayout): RowKernel | null {
  const module = wasmModule('row-kernel');
  if (module === null) {
    return null;
  }
  const kernel = instantiate<KernelExports>(module);
  if (!kernel.configure(layout.fieldCount, layout.outcomes === '±1' ? 1 : 0)) {
    return null;
  }
  // The kernel's column kinds are the round fields (`FIELD` order) from 1; 0 is a column the analysis ignores.
  layout.fieldOfColumn.forEach((field, column) => kernel.setColumn(column, field + 1));
  return new WasmRowKernel(kernel);
}
