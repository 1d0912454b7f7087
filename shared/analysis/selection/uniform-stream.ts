import { KEYSTREAM_BLOCK_BYTES, KeystreamSource } from './keystream';

/** Keystream bytes that decide one round. */
export const BYTES_PER_ROUND = 8;

const ROUNDS_PER_BLOCK = KEYSTREAM_BLOCK_BYTES / BYTES_PER_ROUND;
// 64 KiB of keystream a time: OpenSSL through Node gives about 3 GB/s for that, a third of it for 1 MiB.
const BLOCKS_PER_REFILL = 4096;
const ROUNDS_PER_REFILL = BLOCKS_PER_REFILL * ROUNDS_PER_BLOCK;
const TWO_TO_21 = 2 ** 21;
/** 2^−53: multiplying by it is dividing by 2^53, exactly, and cheaper. */
const TWO_TO_MINUS_53 = 2 ** -53;

/**
 * The uniform number u_i in [0, 1) of round i: keystream bytes 8i .. 8i+7 read as a big-endian 64-bit
 * integer, its top 53 bits divided by 2^53 (exact in a double). Round i thus sits in AES-CTR block
 * ⌊i/2⌋, first half for even i; any reader can start at any round, so the split of a log across
 * threads never changes a decision. The keystream is fetched and turned into numbers 8192 rounds
 * at a time, so `next` is one array read.
 */
export class UniformStream {
  private readonly uniforms = new Float64Array(ROUNDS_PER_REFILL);
  private offset = 0;
  private nextBlock: number;

  /** Starts at round `firstRound`. */
  constructor(
    private readonly keystream: KeystreamSource,
    firstRound: number,
  ) {
    this.nextBlock = Math.floor(firstRound / ROUNDS_PER_BLOCK);
    this.refill();
    this.offset = firstRound % ROUNDS_PER_BLOCK;
  }

  /** u for the next round. */
  next(): number {
    if (this.offset === ROUNDS_PER_REFILL) {
      this.refill();
    }
    return this.uniforms[this.offset++];
  }

  /** The numbers fetched and not used yet (one at least), for a reader that takes many at once and then calls `advance`. */
  pending(): Float64Array {
    if (this.offset === ROUNDS_PER_REFILL) {
      this.refill();
    }
    return this.uniforms.subarray(this.offset);
  }

  /** Passes over `count` of the pending numbers, used by a bulk reader. */
  advance(count: number): void {
    this.offset += count;
  }

  private refill(): void {
    const bytes = this.keystream(this.nextBlock, BLOCKS_PER_REFILL);
    const words = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    const uniforms = this.uniforms;
    for (let round = 0, at = 0; round < ROUNDS_PER_REFILL; round++, at += BYTES_PER_ROUND) {
      // getUint32 reads big-endian unless told otherwise.
      uniforms[round] = (words.getUint32(at) * TWO_TO_21 + (words.getUint32(at + 4) >>> 11)) * TWO_TO_MINUS_53;
    }
    this.nextBlock += BLOCKS_PER_REFILL;
    this.offset = 0;
  }
}
