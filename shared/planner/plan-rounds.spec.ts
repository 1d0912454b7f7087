import { expect } from '@jest/globals';
import { jStat } from 'jstat';
import { parseProfile } from '../analysis/profile';
import { QUANTUM_WIN_FRACTION } from '../analysis/statistics/bell-bounds';
import { chshValueFromWinFraction } from '../analysis/statistics/chsh-value';
import { finiteKeyLength } from '../analysis/statistics/finite-key-length';
import { hoeffdingDeviation } from '../analysis/statistics/hoeffding';
import { samplingDeviation } from '../analysis/statistics/sampling-deviation';
import { chshPassProbability, qberPassProbability } from './criterion-pass';
import { planRounds, PlanInputError } from './plan-rounds';

const profileOf = (parameters: unknown) => {
  const parsed = parseProfile(parameters);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.profile;
};

describe('criterion pass probabilities', () => {
  it('observed CHSH criterion: the binomial tail above the threshold, as jstat’s binomial CDF gives it', () => {
    const profile = profileOf({ chshTolerance: 0.02, criterion: 'observed' });
    const threshold = QUANTUM_WIN_FRACTION - 0.02;
    const fewestWins = Math.ceil(4000 * threshold);
    // Reference: jStat.binomial.cdf (jstat 1.9), P(W ≥ k) = 1 − P(W ≤ k − 1).
    expect(chshPassProbability(4000, 0.836, profile)).toBeCloseTo(1 - jStat.binomial.cdf(fewestWins - 1, 4000, 0.836), 8);
  });

  it('certified criterion: the lower Hoeffding bound must reach the threshold, so more wins are needed', () => {
    const profile = profileOf({ chshTolerance: 0.02, criterion: 'certified', epsilon: 1e-3 });
    const deviation = hoeffdingDeviation(4000, 1e-3);
    const fewestWins = Math.ceil(4000 * (QUANTUM_WIN_FRACTION - 0.02 + deviation));
    // From w⁺ wins on, the lower bound is above the quantum maximum ω_Q: broken data, never a pass.
    const tooManyWins = Math.floor(4000 * (QUANTUM_WIN_FRACTION + deviation)) + 1;
    const jstatTail = (wins: number) => 1 - jStat.binomial.cdf(wins - 1, 4000, 0.86);
    expect(chshPassProbability(4000, 0.86, profile)).toBeCloseTo(jstatTail(fewestWins) - jstatTail(tooManyWins), 8);
    expect(chshPassProbability(4000, 0.86, profile)).toBeLessThan(chshPassProbability(4000, 0.86, profileOf({ chshTolerance: 0.02, criterion: 'observed' })));
  });

  it('no pass without a significant violation: with few rounds even a good device cannot pass the observed criterion', () => {
    // 200 CHSH test rounds at ε = 1e-9: the Hoeffding deviation sqrt(ln(1e9)/400) = 0.2276 keeps
    // the lower bound at or below ¾ up to 195 wins (195/200 − 0.2276 = 0.7474), although the observed
    // threshold 0.8236 is passed from 165 wins on. Reference: P(W ≥ 196) summed exactly in rational
    // arithmetic with Python's fractions module (computed here): 5.402933555810427e-10 (jstat's
    // 1 − cdf gives 5.0000004e-10 there, lost to cancellation).
    const profile = profileOf({ criterion: 'observed' });
    expect(chshPassProbability(200, 0.85, profile) / 5.402933555810427e-10).toBeCloseTo(1, 9);
    expect(chshPassProbability(200, 0.85, profile)).toBeLessThan(1e-9);
  });

  it('observed QBER criterion: the binomial CDF up to the tolerance', () => {
    const profile = profileOf({ qberTolerance: 0.035, criterion: 'observed' });
    expect(qberPassProbability(1000, 0.03, profile)).toBeCloseTo(jStat.binomial.cdf(35, 1000, 0.03), 8);
    expect(qberPassProbability(1000, 0, profile)).toBe(1);
  });
});

describe('planRounds', () => {
  const device = { winFraction: 0.84, qber: 0.02, trialRate: 10_000 };

  it('the expected finite key is the engine’s formula at the expected counts', () => {
    const plan = planRounds({ device, profile: {}, rounds: 2_000_000 });
    const profile = profileOf({});
    // Default profile: half the rounds tested; y uniform over three settings, x fair.
    const tested = 1_000_000;
    const chshRounds = (tested * 2) / 3;
    const keyTested = tested / 6;
    const rawBits = (2_000_000 - tested) / 6;
    expect(plan.at).toMatchObject({ chshTestRounds: chshRounds, keyTestRounds: keyTested, rawKeyBits: rawBits, acquisitionSeconds: 200 });
    const expected = finiteKeyLength({
      rawBits,
      chshValueLower: chshValueFromWinFraction(0.84 - hoeffdingDeviation(chshRounds, profile.epsilon)),
      qberUpper: 0.02 + samplingDeviation(keyTested, rawBits, profile.epsilon),
      reconciliationEfficiency: profile.reconciliationEfficiency,
      epsilonEC: profile.epsilonEC,
      epsilonPA: profile.epsilonPA,
    });
    expect(plan.at.expectedFiniteKeyBits).toBe(Math.max(0, expected));
    expect(plan.at.asymptoticKeyBits).toBeGreaterThan(plan.at.expectedFiniteKeyBits);
  });

  it('finds the smallest budgets: one round fewer no longer gives a key or a likely pass', () => {
    const plan = planRounds({ device, profile: {}, rounds: 2_000_000 });
    const key = plan.roundsForPositiveKey!;
    expect(planRounds({ device, profile: {}, rounds: key }).at.expectedFiniteKeyBits).toBeGreaterThan(0);
    expect(planRounds({ device, profile: {}, rounds: key - 1 }).at.expectedFiniteKeyBits).toBe(0);
    const pass = plan.roundsForLikelyPass!;
    expect(planRounds({ device, profile: {}, rounds: pass }).at.passProbability.all).toBeGreaterThanOrEqual(0.99);
    expect(planRounds({ device, profile: {}, rounds: pass - 1 }).at.passProbability.all).toBeLessThan(0.99);
  });

  it('the best test fraction gives at least as much key as every fraction on the grid', () => {
    const plan = planRounds({ device, profile: { testSelection: { mode: 'bernoulli', probability: 0.5 } }, rounds: 5_000_000 });
    for (const point of plan.testFractionCurve) expect(plan.bestTestFraction.expectedFiniteKeyBits).toBeGreaterThanOrEqual(point.expectedFiniteKeyBits);
    expect(plan.bestTestFraction.testFraction).toBeLessThan(0.5);
  });

  it('a device below the threshold never passes, and says so with null', () => {
    const plan = planRounds({ device: { winFraction: 0.8, qber: 0.02 }, profile: {}, rounds: 1_000_000 });
    expect(plan.at.passProbability.chsh).toBeLessThan(1e-10);
    expect(plan.roundsForLikelyPass).toBeNull();
    expect(plan.at.acquisitionSeconds).toBeNull();
  });

  it('names the bad input', () => {
    expect(() => planRounds({ device: { winFraction: 1.2, qber: 0.02 }, profile: {}, rounds: 1e6 })).toThrow(PlanInputError);
    expect(() => planRounds({ device, profile: { testSelection: { mode: 'from-log' } }, rounds: 1e6 })).toThrow(/share of rounds the lab marks/);
    expect(() => planRounds({ device, profile: { chshTolerance: -1 }, rounds: 1e6 })).toThrow(/The profile is not valid/);
    expect(() => planRounds({ device, profile: {}, rounds: 12.5 })).toThrow(expect.objectContaining({ field: 'rounds' }));
  });
});

describe('planRounds without a budget', () => {
  it('plans at the smallest budget that gives both a positive key and a likely pass', () => {
    const plan = planRounds({ device: { winFraction: 0.84, qber: 0.02 }, profile: {} });
    expect(plan.at.rounds).toBe(Math.max(plan.roundsForPositiveKey!, plan.roundsForLikelyPass!));
    expect(plan.at.expectedFiniteKeyBits).toBeGreaterThan(0);
    expect(plan.at.passProbability.all).toBeGreaterThanOrEqual(0.99);
  });
});
