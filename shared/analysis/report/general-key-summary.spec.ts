import path from 'node:path';
import { analyseLog } from '../node';
import { parseProfile } from '../profile';
import { summariseGeneralKey } from './general-key-summary';

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
  it('gives the published key length for the published design at n = 1.5×10⁶ (95 884 bits, within 2)', () => {
    const general = summariseGeneralKey(1_500_000, profileOf(PUBLISHED))!;
    expect(Math.abs(general.bits - 95_884)).toBeLessThanOrEqual(2);
    expect(general).toMatchObject({ rounds: 1_500_000, testProbability: 13 / 256, syndromeBits: 296_517, reason: null });
    expect(general.omegaThreshold).toBeCloseTo(0.825538, 6);
  });

  it('is absent for a collective profile without its settings', () => {
    expect(summariseGeneralKey(1_500_000, profileOf({}))).toBeNull();
  });

  it('refuses a general profile with a fixed-size test subset, or without its settings', () => {
    expect(parseProfile({ ...PUBLISHED, testSelection: { mode: 'fixed-fraction', fraction: 0.05 } })).toMatchObject({ ok: false, field: 'testSelection.mode', message: expect.stringContaining('a fixed-size subset is refused') });
    expect(parseProfile({ securityModel: 'general', testSelection: { mode: 'bernoulli' } })).toMatchObject({ ok: false, field: 'generalAttack' });
    expect(parseProfile({ ...PUBLISHED, generalAttack: { design: { chshValue: 2.64, qber: 0.018 }, omegaThreshold: 0.8, syndromeBits: 10 } })).toMatchObject({ ok: false });
    expect(parseProfile({ ...PUBLISHED, testSelection: { mode: 'from-log' } })).toMatchObject({ ok: false, field: 'generalAttack.testProbability' });
  });

  it('a short run judged under the general model: threshold ω_thr, no key, and an abort that says why', async () => {
    const profile = { ...PUBLISHED, testSelection: { mode: 'bernoulli', probability: 0.5 }, requirePositiveKey: true };
    const result = await analyseLog({ path: path.join(FIXTURES, 'accepted-run.csv') }, { profile, seed: 'a5'.repeat(32) });
    expect(result.key!.generalAttack).toMatchObject({ rounds: result.input.rounds, testProbability: 0.5, bits: 0, reason: expect.stringContaining('give no key') });
    expect(result.key!.generalAttackBits).toBe(0);
    expect(result.verdict).toBe('ABORT');
    expect(result.reasons).toContainEqual(expect.stringContaining('The key length against general attacks is not positive'));
    expect(result.reasons.join(' ')).not.toContain('ω_Q −');
  }, 60_000);
});
