import { z } from 'zod';
import { queryId, queryNumber } from './query-fields';

/**
 * The round-budget planner's answer (`GET /api/planner`, `npm run plan`, the planner screen), all
 * computed by `planRounds` in shared/planner from the engine's own functions.
 */

/** What the planner assumes of tonight's devices. */
export interface PlanDevice {
  /** Expected CHSH win fraction ω (S = 8ω − 4). */
  winFraction: number;
  /** Expected error rate on the key setting. */
  qber: number;
  /** Probability that station A's setting is x = 0 (1/2 when fair); station B's y is uniform over 0, 1, 2. */
  xZeroProbability: number;
  /** Rounds per second the setup acquires, for the acquisition time; null when not given. */
  trialRate: number | null;
}

/** The expected run at one round budget N. */
export interface PlanPoint {
  rounds: number;
  /** Share of the rounds tested (the profile's, or the planner's own for `from-log`). */
  testFraction: number;
  /** Expected test rounds of each kind and raw key bits. */
  chshTestRounds: number;
  keyTestRounds: number;
  rawKeyBits: number;
  /** Probability that each criterion passes, from the binomial law of the observed counts. */
  passProbability: {
    chsh: number;
    qber: number;
    /** 1 or 0: whether the expected test rounds reach the profile's minimum. */
    minimumTestRounds: number;
    /** 1 or 0 when the profile requires a positive key (judged at the expected values), else 1. */
    positiveKey: number;
    /** The product: CHSH and QBER rest on disjoint rounds, so they are independent. */
    all: number;
  };
  /** The finite key length at the expected counts (collective attacks), bits, ≥ 0. */
  expectedFiniteKeyBits: number;
  /** The asymptotic rate per raw bit at the expected S and QBER (collective attacks). */
  asymptoticRate: number;
  /** rawKeyBits × asymptoticRate: the limit the finite key approaches. */
  asymptoticKeyBits: number;
  /** N / trial rate, seconds; null without a trial rate. */
  acquisitionSeconds: number | null;
}

/** The expected finite key at one test fraction, for the chosen N. */
export interface TestFractionPoint {
  testFraction: number;
  expectedFiniteKeyBits: number;
  passProbability: number;
}

/** The whole plan. */
export interface PlanDto {
  device: PlanDevice;
  /** The plan at the chosen N. */
  at: PlanPoint;
  /** Smallest N with a positive expected finite key, or null when no N up to `searchLimit` gives one. */
  roundsForPositiveKey: number | null;
  /** Smallest N whose pass probability reaches 0.99, or null (for instance when ω is below the threshold). */
  roundsForLikelyPass: number | null;
  /** The largest N searched. */
  searchLimit: number;
  /** Points on a logarithmic grid of N, for the chart. */
  curve: PlanPoint[];
  /** The test fraction that maximises the expected finite key at the chosen N (profiles that fix the fraction ignore it). */
  bestTestFraction: TestFractionPoint;
  testFractionCurve: TestFractionPoint[];
  /** What the planner does not model, in sentences. */
  cautions: string[];
}

/** Query of `GET /api/planner` and `/general-attack`: the device as expected, a profile version, and the round budget. */
export const planQuerySchema = z
  .strictObject({
    winFraction: queryNumber('a win fraction').optional(),
    chshValue: queryNumber('a CHSH value').optional().meta({ description: 'Alternative to `winFraction`: the expected CHSH value S.' }),
    qber: queryNumber('an error rate'),
    profileVersionId: queryId('a profile version'),
    rounds: queryNumber('a round count').optional().meta({ description: 'When absent, the plan is made at the smallest budget giving both a key and a likely pass.' }),
    trialRate: queryNumber('rounds per second').optional(),
    xZeroProbability: queryNumber('a probability').optional(),
    testFraction: queryNumber('a fraction').optional().meta({ description: "Needed when the profile takes its test rounds from the log's marking." }),
  })
  .refine((query) => (query.winFraction === undefined) !== (query.chshValue === undefined), { error: 'give winFraction or chshValue, one of them', path: ['winFraction'] });
export type PlanQuery = z.infer<typeof planQuerySchema>;

/** Query of `GET /api/planner/prefill`. */
export const planPrefillQuerySchema = z.strictObject({ setupId: queryId('a setup') });

/** `GET /api/planner/prefill?setupId=`: what a setup's recent accepted runs did. */
export const planPrefillSchema = z
  .object({
    setupId: z.number().int(),
    profileVersionId: z.number().int().meta({ description: "The setup's default profile, latest version." }),
    runIds: z.array(z.number().int()).meta({ description: 'Accepted runs pooled (the latest ones, at most 10), newest first.' }),
    winFraction: z.number().nullable().meta({ description: 'Pooled over their test rounds; null without accepted runs.' }),
    qber: z.number().nullable(),
    xZeroProbability: z.number().nullable(),
    rounds: z.number().nullable().meta({ description: 'Their median round count.' }),
  })
  .meta({ id: 'PlanPrefillDto' });
export type PlanPrefillDto = z.infer<typeof planPrefillSchema>;

/** What the general-attack key length is planned with. */
export interface GeneralPlanSettingsDto {
  /** `profile`: the profile's own settings; `device`: a protocol designed for the expected device. */
  source: 'profile' | 'device';
  soundness: number;
  /** γ: the probability that a round is tested. */
  testProbability: number;
  /** Design S and QBER (m and ω_thr follow at each N), or null when fixed. */
  design: { chshValue: number; qber: number } | null;
  fixed: { omegaThreshold: number; syndromeBits: number } | null;
}

/** The general-attack key at one round budget and test probability. */
export interface GeneralKeyPoint {
  /** Log rounds N and the probability γ that one is tested. */
  rounds: number;
  testProbability: number;
  /** The sub-protocol the bound is applied to: CHSH test and key-setting generation rounds n′, tested with γ′. */
  sifted: { rounds: number; testProbability: number };
  /** ℓ from entropy accumulation, ≥ 0. */
  bits: number;
  syndromeBits: number;
  omegaThreshold: number;
  /** Why there is no key, when bits is 0. */
  reason: string | null;
  /** Probability that the observed CHSH win fraction reaches ω_thr. */
  chshPassProbability: number;
  /** With the error-rate criterion, the minimum test rounds and (when required) a positive key. */
  passProbability: number;
}

/** `GET /api/planner/general-attack`: the key length against general attacks over N and γ. */
export interface GeneralAttackPlanDto {
  settings: GeneralPlanSettingsDto;
  /** At the chosen N and γ. */
  at: GeneralKeyPoint;
  /** Over a logarithmic grid of N at γ. */
  curve: GeneralKeyPoint[];
  /** Smallest N with a positive general-attack key at γ, or null up to the search limit. */
  roundsForPositiveKey: number | null;
  /** The γ of most key at the chosen N, or null when no γ gives a key there. */
  bestTestProbability: GeneralKeyPoint | null;
  cautions: string[];
}
