import { Cipher, createCipheriv } from 'node:crypto';
import { KEYSTREAM_BLOCK_BYTES, KeystreamSource } from '../selection/keystream';

/** A 256-bit seed written as 64 hex digits. */
export const SEED_PATTERN = /^[0-9a-fA-F]{64}$/;

/**
 * AES-256-CTR keystream from Node's OpenSSL binding: key = the seed, initial counter block = the
 * block number as a 128-bit big-endian integer (zero IV for block 0), applied to zero bytes.
 * Equivalent: `openssl enc -aes-256-ctr -K <seed> -iv 00…00 -nopad` on zero bytes.
 */
export function aesKeystream(seedHex: string): KeystreamSource {
  const key = Buffer.from(seedHex, 'hex');
  let zeros = Buffer.alloc(0);
  // A reader asks for consecutive blocks: the cipher that gave the last ones goes on from there
  // (making one costs tens of microseconds in OpenSSL 3).
  let cipher: Cipher | null = null;
  let nextBlock = -1;
  return (firstBlock, blockCount) => {
    const length = blockCount * KEYSTREAM_BLOCK_BYTES;
    if (zeros.length < length) {
      zeros = Buffer.alloc(length);
    }
    if (cipher === null || firstBlock !== nextBlock) {
      cipher = createCipheriv('aes-256-ctr', key, counterBlock(firstBlock));
    }
    nextBlock = firstBlock + blockCount;
    return cipher.update(zeros.subarray(0, length));
  };
}

/** The 16-byte big-endian counter block of block number `block`. */
function counterBlock(block: number): Buffer {
  const iv = Buffer.alloc(KEYSTREAM_BLOCK_BYTES);
  iv.writeBigUInt64BE(BigInt(block), 8);
  return iv;
}
