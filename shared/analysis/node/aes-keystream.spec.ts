import { execFileSync } from 'node:child_process';
import { aesKeystream } from './aes-keystream';

/** AES-256-CTR keystream from the openssl command line tool: zero bytes encrypted from counter `iv`. */
function opensslKeystream(seed: string, ivHex: string, bytes: number): string {
  return execFileSync('openssl', ['enc', '-aes-256-ctr', '-K', seed, '-iv', ivHex, '-nopad'], { input: Buffer.alloc(bytes) }).toString('hex');
}

describe('aesKeystream', () => {
  const seed = '01'.repeat(32);

  it('matches openssl enc -aes-256-ctr with a zero IV from block 0', () => {
    expect(Buffer.from(aesKeystream(seed)(0, 3)).toString('hex')).toBe(opensslKeystream(seed, '0'.repeat(32), 48));
  });

  it('starts any block by its 128-bit big-endian counter, as openssl does with that IV', () => {
    // Block 1000 = 0x3e8.
    expect(Buffer.from(aesKeystream(seed)(1000, 2)).toString('hex')).toBe(opensslKeystream(seed, '0'.repeat(29) + '3e8', 32));
    expect(Buffer.from(aesKeystream(seed)(1000, 2))).toEqual(Buffer.from(aesKeystream(seed)(0, 1002).subarray(16_000)));
  });
});
