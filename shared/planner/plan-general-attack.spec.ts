import { jStat } from 'jstat';
import { generalAttackKeyLength } from '../analysis/entropy-accumulation';
import { parseProfile } from '../analysis/profile';
import { expectedSiftedProtocol } from '../analysis/report/sifted-protocol';
import { winFractionFromChshValue } from '../analysis/statistics/chsh-value';
import { generalKeyPoint, generalPlanProblem } from './plan-general-attack';
import { planRounds, PlanInputError } from './plan-rounds';

// The published design (Nadlinger et al., Nature 607, 682 (2022), Supplementary Information):
// n = 1.5e6, γ = 13/256, S = 2.64, QBER 1.8 %, total soundness 1e-10 give 95 884 bits (this
// engine's optimiser finds 95 885; see shared/analysis/entropy-accumulation). The bound applies to
// the log's CHSH test and key-setting rounds: N = 8 657 227 log rounds tested with γ = 13/985 hold
// an expected sub-protocol of n′ = 1 500 000 rounds with γ′ = 13/256.
const GAMMA = 13 / 985;
const LOG_ROUNDS = 8_657_227;
const designedProfile = {
  testSelection: { mode: 'bernoulli', probability: GAMMA },
  securityModel: 'general',
  generalAttack: { soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } },
};
const device = { winFraction: winFractionFromChshValue(2.64), qber: 0.018 };
const noRecommendation = { roundsForPositiveKey: null, roundsForLikelyPass: null };
const problemAt = (rounds: number, profile: object = designedProfile) => generalPlanProblem({ device, profile, rounds }, noRecommendation);

// The searches over N and γ (dozens of optimisations each) are checked through `npm run plan --
// --general` in tests/cli/plan.spec.ts: in jest's sandbox each optimisation runs ten times slower.
describe('the general-attack plan', () => {
  it('plans the published design to its published key length, with the CHSH pass chance of ω_thr from jstat’s binomial CDF', () => {
    const point = generalKeyPoint(problemAt(LOG_ROUNDS), LOG_ROUNDS);
    expect(point.sifted.rounds).toBe(1_500_000);
    expect(Math.abs(point.bits - 95_884)).toBeLessThanOrEqual(2);
    expect(point.syndromeBits).toBe(296_517);
    expect(point.omegaThreshold).toBeCloseTo(0.825538, 6);
    // CHSH test rounds γ·N·⅔; the run passes with at least ⌈ω_thr·rounds⌉ wins (jstat 1.9, P(W ≥ k) = 1 − P(W ≤ k − 1)).
    const chshRounds = Math.round(GAMMA * LOG_ROUNDS * (2 / 3));
    const fewestWins = Math.ceil(point.omegaThreshold * chshRounds);
    expect(point.chshPassProbability).toBeCloseTo(1 - jStat.binomial.cdf(fewestWins - 1, chshRounds, device.winFraction), 8);
  });

  it('designs the protocol for the expected device when the profile has no general settings', () => {
    const problem = problemAt(2_000_000, { testSelection: { mode: 'bernoulli', probability: 0.1 } });
    expect(problem.settings).toMatchObject({ source: 'device', soundness: 1e-10, testProbability: 0.1, fixed: null });
    const direct = generalAttackKeyLength({ ...expectedSiftedProtocol(2_000_000, 0.1), soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } });
    expect(generalKeyPoint(problem, 2_000_000).bits).toBe(direct.bits);
  });

  it('refuses to design a protocol for a device at or below the local bound, naming the field', () => {
    expect(() => generalPlanProblem({ device: { winFraction: 0.74, qber: 0.02 }, profile: {}, rounds: 1e6 }, noRecommendation)).toThrow(PlanInputError);
  });

  it('judges the collective plan of a general profile by ω_thr, not by the quantum maximum less the tolerance', () => {
    const parsed = parseProfile(designedProfile);
    if (!parsed.ok) throw new Error(parsed.message);
    const plan = planRounds({ device, profile: designedProfile, rounds: LOG_ROUNDS });
    expect(plan.at.passProbability.chsh).toBeCloseTo(generalKeyPoint(problemAt(LOG_ROUNDS), LOG_ROUNDS).chshPassProbability, 12);
    expect(plan.cautions.join(' ')).toContain('ω_thr of the general model');
  });
});
