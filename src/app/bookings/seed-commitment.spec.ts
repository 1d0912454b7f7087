import { sha256Hex } from '../api/sha256-hex';
import { checkSeedCommitment } from './seed-commitment';

const SEED = '9f2c4e81a7d35b60c8e1f4a29b7d03e56a1c8f42e7b90d35c6a2f81e4b7d09c3';
// printf %s 9f2c4e81…4b7d09c3 | sha256sum (GNU coreutils 9.1)
const COMMITMENT = '777ddf8cec451a4bdc78edf2e608beeaa3a6b5faa240f5c2edae085b77d51ee6';

describe('sha256Hex', () => {
  it('gives the FIPS 180-2 example digest of "abc"', async () => {
    await expect(sha256Hex('abc')).resolves.toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
});

describe('checkSeedCommitment', () => {
  it('accepts the seed whose hex characters hash to the commitment', async () => {
    await expect(checkSeedCommitment(SEED, COMMITMENT)).resolves.toEqual({ matches: true, computed: COMMITMENT });
  });

  it('takes the commitment in either case', async () => {
    await expect(checkSeedCommitment(SEED, COMMITMENT.toUpperCase())).resolves.toMatchObject({ matches: true });
  });

  it('refuses a seed with one character changed, and says what it hashes to', async () => {
    const changed = `${SEED.slice(0, -1)}4`;
    const check = await checkSeedCommitment(changed, COMMITMENT);
    expect(check.matches).toBe(false);
    expect(check.computed).toMatch(/^[0-9a-f]{64}$/);
    expect(check.computed).not.toBe(COMMITMENT);
  });

  it('hashes the hex text, not the bytes it spells (an upper-case seed is another text)', async () => {
    await expect(checkSeedCommitment(SEED.toUpperCase(), COMMITMENT)).resolves.toMatchObject({ matches: false });
  });
});
