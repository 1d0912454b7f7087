/** Bytes per AES block, and so per counter step of AES-CTR. */
export const KEYSTREAM_BLOCK_BYTES = 16;

/**
 * A source of AES-256-CTR keystream: the bytes of blocks `firstBlock` .. `firstBlock + blockCount − 1`,
 * where block j is AES-256(seed, j as a 128-bit big-endian counter), counter from zero and a zero IV,
 * i.e. the encryption of zero bytes. The pure engine takes it injected (Node supplies
 * `crypto.createCipheriv('aes-256-ctr', ...)`), so the same rule runs anywhere.
 */
export type KeystreamSource = (firstBlock: number, blockCount: number) => Uint8Array;
