import { z } from 'zod';

/** The check families a profile can make blocking. */
export const CHECK_FAMILIES = ['log-integrity', 'minimum-test-rounds', 'setting-uniformity', 'no-signalling', 'stationarity', 'test-marks'] as const;

/** A family of checks (`setting-uniformity` covers the x, y and joint tests, and so on). */
export type CheckFamily = (typeof CHECK_FAMILIES)[number];

/** What a profile makes of the timing check of two station logs: shown only, or required to hold. */
export const SPACE_LIKE_SEPARATION_RULES = ['reported', 'required'] as const;

/** A number strictly between 0 and 1 (probabilities, fractions, ε's). */
const openUnitInterval = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .gt(0, { error: `${what} must be above 0` })
    .lt(1, { error: `${what} must be below 1` });

const testSelectionSchema = z.discriminatedUnion(
  'mode',
  [
    z.strictObject({
      mode: z.literal('fixed-fraction'),
      /** Share of the rounds tested: exactly ⌊fraction·N⌋ of them. Default 0.5. */
      fraction: openUnitInterval('the test fraction').default(0.5),
    }),
    z.strictObject({
      mode: z.literal('bernoulli'),
      /** Probability γ that each round is tested, independently. Default 0.5. */
      probability: openUnitInterval('the test probability').default(0.5),
    }),
    z.strictObject({
      /** The lab's own marking: the log's `test` column. */
      mode: z.literal('from-log'),
    }),
  ],
  { error: 'mode must be one of fixed-fraction, bernoulli, from-log' },
);

/**
 * What the general-attack key length is computed with (entropy accumulation; see
 * shared/analysis/entropy-accumulation): the total soundness, and either the design S and QBER
 * (from which the syndrome length and threshold follow) or the threshold and syndrome length.
 */
const generalAttackSchema = z
  .strictObject({
    /** Total soundness ε of the protocol. Default 1e-10. */
    soundness: openUnitInterval('the soundness').default(1e-10),
    /** Design values: m and ω_thr follow from the published design equations at the run's N. */
    design: z
      .strictObject({
        chshValue: z
          .number({ error: 'must be a number' })
          .gt(2, { error: 'must be above 2 (the local bound)' })
          .lte(2 * Math.SQRT2, { error: 'must be at most 2√2' }),
        qber: openUnitInterval('the design QBER').lt(0.5, { error: 'the design QBER must be below 0.5' }),
      })
      .optional(),
    /** Or fixed in advance: the acceptance threshold on the CHSH win fraction and the syndrome length. */
    omegaThreshold: z.number({ error: 'must be a number' }).gt(0.75, { error: 'must be above 3/4 (the local bound)' }).lt(1, { error: 'must be below 1' }).optional(),
    syndromeBits: z.number({ error: 'must be a number' }).int({ error: 'must be a whole number' }).min(0, { error: 'must be at least 0' }).optional(),
    /** The test probability γ the lab's marking uses (needed with `from-log` selection). */
    testProbability: openUnitInterval('the test probability').optional(),
  })
  .refine((settings) => (settings.design !== undefined) !== (settings.omegaThreshold !== undefined || settings.syndromeBits !== undefined), {
    error: 'give either design (chshValue, qber) or omegaThreshold with syndromeBits',
  })
  .refine((settings) => settings.design !== undefined || (settings.omegaThreshold !== undefined && settings.syndromeBits !== undefined), {
    error: 'omegaThreshold and syndromeBits go together',
  });

/** The schema of an analysis profile; every field has a default, so `{}` is a complete profile. */
export const profileSchema = z
  .strictObject({
    /** How test rounds are chosen. Default: fixed-fraction, half the rounds. */
    testSelection: testSelectionSchema.prefault({ mode: 'fixed-fraction' }),
    /** Accept when the CHSH win fraction reaches ω_Q − chshTolerance. Default 0.03 (common practice 0.01–0.05). */
    chshTolerance: z
      .number({ error: 'must be a number' })
      .gt(0, { error: 'must be above 0' })
      .max(0.25, { error: 'must be at most 0.25 (ω_Q − 0.25 is below the local bound)' })
      .default(0.03),
    /** Accept when the error rate on the key setting is at most qberTolerance. Default 0.05 (common practice 2–8%). */
    qberTolerance: z.number({ error: 'must be a number' }).gt(0, { error: 'must be above 0' }).max(0.5, { error: 'must be at most 0.5' }).default(0.05),
    /** Failure probability of every confidence bound (Hoeffding, sampling). Default 1e-9 (common practice 1e-6–1e-12). */
    epsilon: openUnitInterval('epsilon').default(1e-9),
    /**
     * `certified`: the confidence-corrected values against the thresholds; `observed`: the observed
     * ones. Default certified. Under either, ACCEPT needs the lower bound of the win fraction above ¾.
     */
    criterion: z.enum(['observed', 'certified'], { error: 'must be observed or certified' }).default('certified'),
    /** Fewest CHSH test rounds and fewest key-setting test rounds accepted. Default 1000 (common practice, no source). */
    minTestRounds: z.number({ error: 'must be a number' }).int({ error: 'must be a whole number' }).min(1, { error: 'must be at least 1' }).default(1000),
    /** Error-correction efficiency f ≥ 1. Default 1.15 (common practice 1.1–1.2, no source). */
    reconciliationEfficiency: z.number({ error: 'must be a number' }).min(1, { error: 'must be at least 1' }).max(2, { error: 'must be at most 2' }).default(1.15),
    /** Failure probability of error correction, ε_EC. Default 1e-10. */
    epsilonEC: openUnitInterval('epsilonEC').default(1e-10),
    /** Failure probability of privacy amplification, ε_PA. Default 1e-10. */
    epsilonPA: openUnitInterval('epsilonPA').default(1e-10),
    /** A statistical check fails when its p-value falls below this. Default 0.001 (common practice, no source). */
    significance: openUnitInterval('significance').default(0.001),
    /**
     * Largest share of the trigger span (first to last round index) that may be missing from the log;
     * beyond it the run never passes. Default 0.001 (common practice, no source).
     */
    missingRoundsTolerance: z.number({ error: 'must be a number' }).min(0, { error: 'must be at least 0' }).lt(0.5, { error: 'must be below 0.5' }).default(0.001),
    /** Number of consecutive blocks for the stationarity check. Default 10. */
    driftBlocks: z
      .number({ error: 'must be a number' })
      .int({ error: 'must be a whole number' })
      .min(2, { error: 'must be at least 2' })
      .max(1000, { error: 'must be at most 1000' })
      .default(10),
    /** Whether ACCEPT also needs a positive finite key. Default false. */
    requirePositiveKey: z.boolean({ error: 'must be true or false' }).default(false),
    /** Check families whose failure aborts the run; the others only warn. Default: all but stationarity. */
    blockingChecks: z
      .array(z.enum(CHECK_FAMILIES, { error: `must be one of ${CHECK_FAMILIES.join(', ')}` }))
      .default(['log-integrity', 'minimum-test-rounds', 'setting-uniformity', 'no-signalling']),
    /**
     * The attack model of the key figure that counts: `collective` (i.i.d. devices, the finite key
     * estimate) or `general` (any attack: the entropy-accumulation key length). Default collective.
     */
    securityModel: z.enum(['collective', 'general'], { error: 'must be collective or general' }).default('collective'),
    /** Settings of the general-attack key length; required when securityModel is general. */
    generalAttack: generalAttackSchema.optional(),
    /**
     * The timing check of two station logs: `reported` shows its figures and leaves the verdict to
     * the other rules; `required` makes a run INVALID when its timing cannot be checked (one joined
     * log, no distance, a log without times) and aborts it when any round lacks space-like
     * separation. Default reported.
     */
    spaceLikeSeparation: z.enum(SPACE_LIKE_SEPARATION_RULES, { error: 'must be reported or required' }).default('reported'),
  })
  .superRefine((profile, context) => {
    if (profile.securityModel !== 'general') return;
    if (profile.testSelection.mode === 'fixed-fraction') {
      context.addIssue({
        code: 'custom',
        path: ['testSelection', 'mode'],
        message: 'a general-attack profile needs each round tested with a fixed probability (bernoulli or from-log); a fixed-size subset is refused',
      });
    }
    if (profile.generalAttack === undefined) {
      context.addIssue({ code: 'custom', path: ['generalAttack'], message: 'is required when securityModel is general' });
    } else if (profile.testSelection.mode === 'from-log' && profile.generalAttack.testProbability === undefined) {
      context.addIssue({
        code: 'custom',
        path: ['generalAttack', 'testProbability'],
        message: 'is required with from-log selection: the probability with which the lab marks test rounds',
      });
    }
  });

/** A complete analysis profile, defaults filled in. */
export type AnalysisProfile = z.output<typeof profileSchema>;

/** A profile as written by a user: any field may be left out. */
export type AnalysisProfileInput = z.input<typeof profileSchema>;

/** How test rounds are chosen. */
export type TestSelection = AnalysisProfile['testSelection'];

/** Either a complete profile or the first problem, naming the field. */
export type ProfileParse = { ok: true; profile: AnalysisProfile } | { ok: false; field: string; message: string };

/** Validates a profile and fills in the defaults; a bad profile gets a message naming the field. */
export function parseProfile(input: unknown): ProfileParse {
  const parsed = profileSchema.safeParse(input ?? {});
  if (parsed.success) {
    return { ok: true, profile: parsed.data };
  }
  const issue = parsed.error.issues[0];
  const keys = issue.code === 'unrecognized_keys' ? issue.keys : [];
  const path = [...issue.path, ...keys.slice(0, 1)].map(String);
  const field = path.length > 0 ? path.join('.') : '(profile)';
  const message = issue.code === 'unrecognized_keys' ? `unknown field (the profile has no field ${field})` : issue.message;
  return { ok: false, field, message: `profile field ${field}: ${message}` };
}
