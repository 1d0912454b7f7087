import { KeystreamSource } from './keystream';
import { UniformStream } from './uniform-stream';

/** A fake keystream whose block j holds the bytes j, j+1, ... (mod 256), to check the byte positions. */
const counting: KeystreamSource = (first, count) => Uint8Array.from({ length: count * 16 }, (_, i) => (first * 16 + i) & 0xff);

describe('UniformStream', () => {
  it('reads round i from keystream bytes 8i..8i+7, top 53 bits over 2^53', () => {
    // Bytes 00 01 02 03 04 05 06 07 as a big-endian integer, shifted right by 11, over 2^53 (hand computation).
    const expected = Number(BigInt('0x0001020304050607') >> 11n) / 2 ** 53;
    expect(new UniformStream(counting, 0).next()).toBe(expected);
  });

  it('starts mid-block for an odd round and gives what reading from round 0 gives', () => {
    const fromZero = new UniformStream(counting, 0);
    const sequence = Array.from({ length: 9000 }, () => fromZero.next());
    const fromOdd = new UniformStream(counting, 8191);
    expect(fromOdd.next()).toBe(sequence[8191]);
    expect(fromOdd.next()).toBe(sequence[8192]);
  });

  it('stays in [0, 1) at the extremes', () => {
    const ones: KeystreamSource = (_, count) => new Uint8Array(count * 16).fill(0xff);
    const u = new UniformStream(ones, 0).next();
    expect(u).toBeLessThan(1);
    expect(u).toBe(1 - 2 ** -53);
  });
});
