import { z } from 'zod';
import { queryId, queryNumber } from './query-fields';

/**
 * The round-budget planner's answer (`GET /api/planner`, `npm run plan`, the planner screen), all
 * computed by `planRounds` in shared/planner from the engine's own functions.
 */

/** A number with its meaning. */
const described = /* @__NO_SIDE_EFFECTS__ */ (description: string) => z.number().meta({ description });

/** What the planner assumes of tonight's devices. */
export const planDeviceSchema = /* @__PURE__ */ z
  .object({
    winFraction: described('Expected CHSH win fraction ω (S = 8ω − 4).'),
    qber: described('Expected error rate on the key setting.'),
    xZeroProbability: described("Probability that station A's setting is x = 0 (1/2 when fair); station B's y is uniform over 0, 1, 2."),
    trialRate: z.number().nullable().meta({ description: 'Rounds per second the setup acquires, for the acquisition time; null when not given.' }),
  })
  .meta({ id: 'PlanDevice' });
export type PlanDevice = z.infer<typeof planDeviceSchema>;

/** The expected run at one round budget N. */
export const planPointSchema = /* @__PURE__ */ z
  .object({
    rounds: z.number(),
    testFraction: described("Share of the rounds tested (the profile's, or the planner's own for `from-log`)."),
    chshTestRounds: described('Expected CHSH test rounds.'),
    keyTestRounds: described('Expected key-setting test rounds.'),
    rawKeyBits: described('Expected raw key bits.'),
    passProbability: z
      .object({
        chsh: z.number(),
        qber: z.number(),
        minimumTestRounds: described("1 or 0: whether the expected test rounds reach the profile's minimum."),
        positiveKey: described('1 or 0 when the profile requires a positive key (judged at the expected values), else 1.'),
        all: described('The product: CHSH and QBER rest on disjoint rounds, so they are independent.'),
      })
      .meta({ description: 'Probability that each criterion passes, from the binomial law of the observed counts.' }),
    expectedFiniteKeyBits: described('The finite key length at the expected counts (collective attacks), bits, ≥ 0.'),
    asymptoticRate: described('The asymptotic rate per raw bit at the expected S and QBER (collective attacks).'),
    asymptoticKeyBits: described('rawKeyBits × asymptoticRate: the limit the finite key approaches.'),
    acquisitionSeconds: z.number().nullable().meta({ description: 'N / trial rate, seconds; null without a trial rate.' }),
  })
  .meta({ id: 'PlanPoint' });
export type PlanPoint = z.infer<typeof planPointSchema>;

/** The expected finite key at one test fraction, for the chosen N. */
export const testFractionPointSchema = /* @__PURE__ */ z
  .object({ testFraction: z.number(), expectedFiniteKeyBits: z.number(), passProbability: z.number() })
  .meta({ id: 'TestFractionPoint' });
export type TestFractionPoint = z.infer<typeof testFractionPointSchema>;

/** The whole plan. */
export const planSchema = /* @__PURE__ */ z
  .object({
    device: planDeviceSchema,
    at: planPointSchema.meta({ description: 'The plan at the chosen N.' }),
    roundsForPositiveKey: z.number().nullable().meta({ description: 'Smallest N with a positive expected finite key, or null when no N up to `searchLimit` gives one.' }),
    roundsForLikelyPass: z.number().nullable().meta({ description: 'Smallest N whose pass probability reaches 0.99, or null (for instance when ω is below the threshold).' }),
    searchLimit: described('The largest N searched.'),
    curve: z.array(planPointSchema).meta({ description: 'Points on a logarithmic grid of N, for the chart.' }),
    bestTestFraction: testFractionPointSchema.meta({
      description: 'The test fraction that maximises the expected finite key at the chosen N (profiles that fix the fraction ignore it).',
    }),
    testFractionCurve: z.array(testFractionPointSchema),
    cautions: z.array(z.string()).meta({ description: 'What the planner does not model, in sentences.' }),
  })
  .meta({ id: 'PlanDto' });
export type PlanDto = z.infer<typeof planSchema>;

/** Query of `GET /api/planner` and `/general-attack`: the device as expected, a profile version, and the round budget. */
export const planQuerySchema = /* @__PURE__ */ z
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
export const planPrefillQuerySchema = /* @__PURE__ */ z.strictObject({ setupId: queryId('a setup') }).meta({ description: 'The setup whose runs fill the plan in.' });

/** `GET /api/planner/prefill?setupId=`: what a setup's recent accepted runs did. */
export const planPrefillSchema = /* @__PURE__ */ z
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
export const generalPlanSettingsSchema = /* @__PURE__ */ z
  .object({
    source: z.enum(['profile', 'device']).meta({ description: "`profile`: the profile's own settings; `device`: a protocol designed for the expected device." }),
    soundness: z.number(),
    testProbability: described('γ: the probability that a round is tested.'),
    design: z.object({ chshValue: z.number(), qber: z.number() }).nullable().meta({ description: 'Design S and QBER (m and ω_thr follow at each N), or null when fixed.' }),
    fixed: z.object({ omegaThreshold: z.number(), syndromeBits: z.number() }).nullable(),
  })
  .meta({ id: 'GeneralPlanSettingsDto' });
export type GeneralPlanSettingsDto = z.infer<typeof generalPlanSettingsSchema>;

/** The general-attack key at one round budget and test probability. */
export const generalKeyPointSchema = /* @__PURE__ */ z
  .object({
    rounds: described('Log rounds N.'),
    testProbability: described('The probability γ that a round is tested.'),
    sifted: z
      .object({ rounds: z.number(), testProbability: z.number() })
      .meta({ description: 'The sub-protocol the bound is applied to: CHSH test and key-setting generation rounds n′, tested with γ′.' }),
    bits: described('ℓ from entropy accumulation, ≥ 0.'),
    syndromeBits: z.number(),
    omegaThreshold: z.number(),
    reason: z.string().nullable().meta({ description: 'Why there is no key, when bits is 0.' }),
    chshPassProbability: described('Probability that the observed CHSH win fraction reaches ω_thr.'),
    passProbability: described('With the error-rate criterion, the minimum test rounds and (when required) a positive key.'),
  })
  .meta({ id: 'GeneralKeyPoint' });
export type GeneralKeyPoint = z.infer<typeof generalKeyPointSchema>;

/** `GET /api/planner/general-attack`: the key length against general attacks over N and γ. */
export const generalAttackPlanSchema = /* @__PURE__ */ z
  .object({
    settings: generalPlanSettingsSchema,
    at: generalKeyPointSchema.meta({ description: 'At the chosen N and γ.' }),
    curve: z.array(generalKeyPointSchema).meta({ description: 'Over a logarithmic grid of N at γ.' }),
    roundsForPositiveKey: z.number().nullable().meta({ description: 'Smallest N with a positive general-attack key at γ, or null up to the search limit.' }),
    // A union, not .nullable(): the OpenAPI generator drops the null of a nullable named schema.
    bestTestProbability: z.union([generalKeyPointSchema, z.null()]).meta({ description: 'The γ of most key at the chosen N, or null when no γ gives a key there.' }),
    cautions: z.array(z.string()),
  })
  .meta({ id: 'GeneralAttackPlanDto' });
export type GeneralAttackPlanDto = z.infer<typeof generalAttackPlanSchema>;
