import { expect } from '@jest/globals';
import path from 'node:path';
import { analyseLog } from '../node';
import { parseProfile } from '../profile';
import { summariseGeneralKey } from './general-key-summary';
import { expectedSiftedProtocol, siftedTestProbability } from './sifted-protocol';

const FIXTURES = path.join(__dirname, '../../../fixtures/logs');

/** The published design (Nadlinger et al., Nature 607, 682 (2022), Supplementary Proposition 2): γ = 13/256, S = 2.64, Q = 1.8 %, soundness 1e-10. */
const PUBLISHED = {
  testSelection: { mode: 'bernoulli', probability: 13 / 256 },
  securityModel: 'general',
  generalAttack: { soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } },
};

const profileOf = (parameters: unknown) => {
  const parsed = parseProfile(parameters);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.profile;
};

describe('the general-attack key figure of a run', () => {
  it('gives the published key length when the run’s sub-protocol is the published one: n′ = 1.5×10⁶, γ′ = 13/256 (95 884 bits, within 2)', () => {
    // γ = 13/985 of the log gives γ′ = 4γ/(1 + 3γ) = 52/1024 = 13/256 for the sub-protocol.
    const profile = profileOf({ ...PUBLISHED, testSelection: { mode: 'bernoulli', probability: 13 / 985 } });
    const general = summariseGeneralKey({ logRounds: 8_657_227, chshTestRounds: 76_172, keyGenerationRounds: 1_423_828 }, profile)!;
    expect(Math.abs(general.bits - 95_884)).toBeLessThanOrEqual(2);
    expect(general).toMatchObject({ rounds: 1_500_000, logRounds: 8_657_227, logTestProbability: 13 / 985, syndromeBits: 296_517, reason: null });
    expect(general.testProbability).toBeCloseTo(13 / 256, 15);
    expect(general.omegaThreshold).toBeCloseTo(0.825538, 6);
  });

  it('maps the log’s γ onto the sub-protocol of CHSH test and key-setting rounds: γ′ = ⅔γ / (⅔γ + ⅙(1 − γ))', () => {
    expect(siftedTestProbability(13 / 985)).toBeCloseTo(13 / 256, 15);
    expect(siftedTestProbability(0.2)).toBeCloseTo(0.8 / 1.6, 15);
    expect(expectedSiftedProtocol(6_000_000, 0.2)).toEqual({ rounds: 6_000_000 * (0.4 / 3 + 0.8 / 6), testProbability: siftedTestProbability(0.2) });
  });

  it('never gives more key than the run’s raw key of key-setting generation rounds', () => {
    // A long, good run: on all its rounds the bound would promise more bits than the raw key holds.
    for (const probability of [0.005, 0.02, 0.05]) {
      const profile = profileOf({ ...PUBLISHED, testSelection: { mode: 'bernoulli', probability } });
      const sifted = expectedSiftedProtocol(20_000_000, probability);
      const keyGenerationRounds = Math.round((20_000_000 * (1 - probability)) / 6);
      const general = summariseGeneralKey({ logRounds: 20_000_000, chshTestRounds: sifted.rounds - keyGenerationRounds, keyGenerationRounds }, profile)!;
      expect(general.bits).toBeGreaterThan(0);
      expect(general.bits).toBeLessThan(keyGenerationRounds);
    }
  }, 60_000);

  it('is absent for a collective profile without its settings', () => {
    expect(summariseGeneralKey({ logRounds: 1_500_000, chshTestRounds: 50_000, keyGenerationRounds: 240_000 }, profileOf({}))).toBeNull();
  });

  it('refuses a general profile with a fixed-size test subset, or without its settings', () => {
    expect(parseProfile({ ...PUBLISHED, testSelection: { mode: 'fixed-fraction', fraction: 0.05 } })).toMatchObject({
      ok: false,
      field: 'testSelection.mode',
      message: expect.stringContaining('a fixed-size subset is refused'),
    });
    expect(parseProfile({ securityModel: 'general', testSelection: { mode: 'bernoulli' } })).toMatchObject({ ok: false, field: 'generalAttack' });
    expect(parseProfile({ ...PUBLISHED, generalAttack: { design: { chshValue: 2.64, qber: 0.018 }, omegaThreshold: 0.8, syndromeBits: 10 } })).toMatchObject({ ok: false });
    expect(parseProfile({ ...PUBLISHED, testSelection: { mode: 'from-log' } })).toMatchObject({ ok: false, field: 'generalAttack.testProbability' });
  });

  it('a short run judged under the general model: threshold ω_thr, no key, and an abort that says why', async () => {
    const profile = { ...PUBLISHED, testSelection: { mode: 'bernoulli', probability: 0.5 }, requirePositiveKey: true };
    const result = await analyseLog({ path: path.join(FIXTURES, 'accepted-run.csv') }, { profile, seed: 'a5'.repeat(32) });
    expect(result.key!.generalAttack).toMatchObject({
      rounds: result.chsh!.rounds + result.key!.rawBits,
      logRounds: result.input.rounds,
      logTestProbability: 0.5,
      bits: 0,
      reason: expect.stringContaining('give no key'),
    });
    expect(result.key!.generalAttackBits).toBe(0);
    expect(result.verdict).toBe('ABORT');
    expect(result.reasons).toContainEqual(expect.stringContaining('The key length against general attacks is not positive'));
    expect(result.reasons.join(' ')).not.toContain('ω_Q −');
  }, 60_000);
});
