import { parseProfile } from './profile';

describe('parseProfile', () => {
  it('fills in every default from an empty profile', () => {
    const parsed = parseProfile({});
    expect(parsed).toEqual({
      ok: true,
      profile: {
        testSelection: { mode: 'fixed-fraction', fraction: 0.5 },
        chshTolerance: 0.03,
        qberTolerance: 0.05,
        epsilon: 1e-9,
        criterion: 'certified',
        minTestRounds: 1000,
        reconciliationEfficiency: 1.15,
        epsilonEC: 1e-10,
        epsilonPA: 1e-10,
        significance: 0.001,
        missingRoundsTolerance: 0.001,
        driftBlocks: 10,
        requirePositiveKey: false,
        blockingChecks: ['log-integrity', 'minimum-test-rounds', 'setting-uniformity', 'no-signalling'],
        securityModel: 'collective',
        spaceLikeSeparation: 'reported',
      },
    });
  });

  it('keeps given values and fills the selection default inside a mode', () => {
    const parsed = parseProfile({ testSelection: { mode: 'bernoulli' }, criterion: 'observed' });
    expect(parsed.ok && parsed.profile.testSelection).toEqual({ mode: 'bernoulli', probability: 0.5 });
    expect(parsed.ok && parsed.profile.criterion).toBe('observed');
  });

  it.each([
    [{ chshTolerance: -1 }, 'chshTolerance', 'above 0'],
    [{ testSelection: { mode: 'fixed-fraction', fraction: 1.5 } }, 'testSelection.fraction', 'below 1'],
    [{ testSelection: { mode: 'lottery' } }, 'testSelection.mode', 'fixed-fraction, bernoulli, from-log'],
    [{ minTestRounds: 2.5 }, 'minTestRounds', 'whole number'],
    [{ blockingChecks: ['stationarity', 'luck'] }, 'blockingChecks.1', 'must be one of'],
    [{ qbertolerance: 0.1 }, 'qbertolerance', 'unknown field'],
    [{ criterion: 'strict' }, 'criterion', 'observed or certified'],
    [{ spaceLikeSeparation: 'always' }, 'spaceLikeSeparation', 'reported or required'],
  ])('rejects %j naming the field', (input, field, words) => {
    const parsed = parseProfile(input);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) {
      expect(parsed.field).toBe(field);
      expect(parsed.message).toContain(field);
      expect(parsed.message).toContain(words);
    }
  });

  it('rejects a profile that is not an object', () => {
    const parsed = parseProfile([1, 2]);
    expect(parsed.ok).toBe(false);
  });
});
