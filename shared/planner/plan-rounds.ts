import { parseProfile, type AnalysisProfile } from '../analysis/profile';
import { summariseChsh } from '../analysis/report/chsh-summary';
import { summariseKey } from '../analysis/report/key-summary';
import { summariseQber } from '../analysis/report/qber-summary';
import type { PlanDevice, PlanDto, PlanPoint, TestFractionPoint } from '../api/planner';
import { chshPassProbability, qberPassProbability } from './criterion-pass';
import { CHSH_SETTING_SHARE, expectedCountTable } from './expected-counts';
import { generalPlanSettings, generalThresholdAt } from './general-plan-settings';
import { firstIndexWhere } from './monotone-search';

/** What the planner is asked. */
export interface PlanInput {
  device: { winFraction: number; qber: number; xZeroProbability?: number; trialRate?: number | null };
  /** A profile version's parameters (parsed here). */
  profile: unknown;
  /** The round budget N; when absent, the smallest that gives both a positive key and a likely pass. */
  rounds?: number;
  /** The share of rounds tested, for a profile that takes its test rounds from the log. */
  testFraction?: number;
}

/** A planner input that cannot be planned with, named by its field. */
export class PlanInputError extends Error {
  constructor(
    message: string,
    readonly field: string,
  ) {
    super(message);
    this.name = 'PlanInputError';
  }
}

/** The pass probability asked of `roundsForLikelyPass`. */
export const LIKELY_PASS = 0.99;
/** The largest round budget searched (10^10 rounds: a day at 10^5 rounds per second). */
export const SEARCH_LIMIT = 1e10;
const SMALLEST_PLANNED = 100;
const CURVE_POINTS_PER_DECADE = 8;
const FRACTION_STEP = 0.02;

/**
 * The round-budget plan: the expected run at N (pass probabilities from the binomial law of the
 * observed counts around the expected values; key figures from the engine's own summaries of the
 * expected count tables), the smallest N for a positive key and for a likely pass, a curve over N
 * and the best test fraction at N.
 */
export function planRounds(input: PlanInput): PlanDto {
  const { device, profile, fixedFraction } = validated(input);
  // Under the general model the CHSH criterion is ω_thr, which moves with N and γ (cheap to compute);
  // the general-attack key length itself, costlier, is planned apart (`planGeneralAttack`).
  const general = profile.securityModel === 'general' ? generalPlanSettings(profile, device, fixedFraction) : null;
  const thresholdAt = (rounds: number, testFraction: number) =>
    general && !('unavailable' in general) ? generalThresholdAt(general, rounds, testFraction, device.xZeroProbability) : undefined;
  const pointAt = (rounds: number, testFraction = fixedFraction) => planPoint(device, profile, rounds, testFraction, thresholdAt(rounds, testFraction));

  const budgets = logGrid(SMALLEST_PLANNED, SEARCH_LIMIT, CURVE_POINTS_PER_DECADE);
  const smallest = (holds: (point: PlanPoint) => boolean) => {
    const index = firstIndexWhere(0, budgets.length - 1, (i) => holds(pointAt(budgets[i])));
    if (index === null) return null;
    // Refine between the grid point that fails and the one that holds.
    const low = index === 0 ? 1 : Math.floor(budgets[index - 1]);
    return firstIndexWhere(low, Math.ceil(budgets[index]), (rounds) => holds(pointAt(rounds)));
  };

  const roundsForPositiveKey = smallest((point) => point.expectedFiniteKeyBits > 0);
  const roundsForLikelyPass = smallest((point) => point.passProbability.all >= LIKELY_PASS);
  const rounds = input.rounds ?? recommendedRounds(roundsForPositiveKey, roundsForLikelyPass);
  const at = pointAt(rounds);

  const fractionPoint = (testFraction: number): TestFractionPoint => {
    const point = pointAt(rounds, testFraction);
    return { testFraction, expectedFiniteKeyBits: point.expectedFiniteKeyBits, passProbability: point.passProbability.all };
  };
  const testFractionCurve = Array.from({ length: Math.round(1 / FRACTION_STEP) - 1 }, (_, i) => fractionPoint(round6((i + 1) * FRACTION_STEP)));

  return {
    device,
    at,
    roundsForPositiveKey,
    roundsForLikelyPass,
    searchLimit: SEARCH_LIMIT,
    curve: budgets.map((rounds) => pointAt(Math.round(rounds))),
    bestTestFraction: bestFraction(testFractionCurve, fractionPoint),
    testFractionCurve,
    cautions: cautionsFor(profile),
  };
}

/** The budget planned when none is given: enough for both a key and a likely pass, else the search limit. */
export function recommendedRounds(forKey: number | null, forPass: number | null): number {
  return forKey === null || forPass === null ? SEARCH_LIMIT : Math.max(forKey, forPass);
}

/**
 * The expected run at one budget and test fraction; `generalThreshold` is ω_thr for a
 * general-attack profile, whose positive-key requirement is judged on the general key instead.
 */
export function planPoint(device: PlanDevice, profile: AnalysisProfile, rounds: number, testFraction: number, generalThreshold?: number): PlanPoint {
  // fixed-fraction tests exactly ⌊fraction·N⌋ rounds; the others test each round with that probability.
  const testRounds = profile.testSelection.mode === 'fixed-fraction' ? Math.floor(testFraction * rounds) : testFraction * rounds;
  const test = expectedCountTable(device, testRounds);
  const generation = expectedCountTable(device, rounds - testRounds);
  const chsh = summariseChsh(test, generation, profile.epsilon);
  const qber = summariseQber(test, generation, profile.epsilon);
  // The collective key only: the general one is planned apart (an optimisation per point).
  const key = summariseKey(chsh, qber, { ...profile, generalAttack: undefined }, rounds);

  const chshTestRounds = testRounds * CHSH_SETTING_SHARE;
  const keyTestRounds = qber.rounds;
  const blocking = (family: AnalysisProfile['blockingChecks'][number]) => profile.blockingChecks.includes(family);
  const minimumTestRounds = !blocking('minimum-test-rounds') || Math.min(chshTestRounds, keyTestRounds) >= profile.minTestRounds ? 1 : 0;
  const positiveKey = !profile.requirePositiveKey || profile.securityModel === 'general' || key.finiteKeyBits > 0 ? 1 : 0;
  const chshPass = chshPassProbability(Math.round(chshTestRounds), device.winFraction, profile, generalThreshold);
  const qberPass = qberPassProbability(Math.round(keyTestRounds), device.qber, profile);
  const asymptoticRate = key.asymptoticRate ?? 0;
  return {
    rounds,
    testFraction,
    chshTestRounds,
    keyTestRounds,
    rawKeyBits: key.rawBits,
    passProbability: { chsh: chshPass, qber: qberPass, minimumTestRounds, positiveKey, all: chshPass * qberPass * minimumTestRounds * positiveKey },
    expectedFiniteKeyBits: key.finiteKeyBits,
    asymptoticRate,
    asymptoticKeyBits: Math.max(0, asymptoticRate) * key.rawBits,
    acquisitionSeconds: device.trialRate === null ? null : rounds / device.trialRate,
  };
}

/** The grid point of most key, refined by golden-section search between its neighbours. */
function bestFraction(curve: TestFractionPoint[], pointAt: (fraction: number) => TestFractionPoint): TestFractionPoint {
  const best = curve.reduce((top, point) => (point.expectedFiniteKeyBits > top.expectedFiniteKeyBits ? point : top), curve[0]);
  if (best.expectedFiniteKeyBits <= 0) return best;
  let low = Math.max(FRACTION_STEP / 2, best.testFraction - FRACTION_STEP);
  let high = Math.min(1 - FRACTION_STEP / 2, best.testFraction + FRACTION_STEP);
  const ratio = (Math.sqrt(5) - 1) / 2;
  for (let step = 0; step < 30; step++) {
    const left = high - ratio * (high - low);
    const right = low + ratio * (high - low);
    if (pointAt(left).expectedFiniteKeyBits >= pointAt(right).expectedFiniteKeyBits) high = right;
    else low = left;
  }
  const refined = pointAt(round6((low + high) / 2));
  return refined.expectedFiniteKeyBits >= best.expectedFiniteKeyBits ? refined : best;
}

/** The checked device, profile and test fraction of a planner input. */
export function validated(input: PlanInput) {
  const parsed = parseProfile(input.profile);
  if (!parsed.ok) throw new PlanInputError(`The profile is not valid: ${parsed.message}`, 'profile');
  const profile = parsed.profile;
  const { winFraction, qber } = input.device;
  const xZeroProbability = input.device.xZeroProbability ?? 0.5;
  const trialRate = input.device.trialRate ?? null;
  requireRange(winFraction, 0, 1, 'winFraction', 'The expected win fraction');
  requireRange(qber, 0, 0.5, 'qber', 'The expected QBER', true);
  requireRange(xZeroProbability, 0, 1, 'xZeroProbability', 'The probability of x = 0');
  if (input.rounds !== undefined && (!Number.isInteger(input.rounds) || input.rounds < SMALLEST_PLANNED || input.rounds > SEARCH_LIMIT)) {
    throw new PlanInputError(`The round budget must be a whole number from ${SMALLEST_PLANNED} to ${SEARCH_LIMIT.toExponential()}; it is ${input.rounds}.`, 'rounds');
  }
  if (trialRate !== null && !(trialRate > 0 && Number.isFinite(trialRate)))
    throw new PlanInputError(`The trial rate must be a positive number of rounds per second; it is ${trialRate}.`, 'trialRate');
  const selection = profile.testSelection;
  let fixedFraction: number;
  if (selection.mode === 'from-log' && profile.securityModel === 'general') {
    // A general-attack profile fixes the probability its marking tests rounds with.
    fixedFraction = profile.generalAttack!.testProbability!;
  } else if (selection.mode === 'from-log') {
    if (input.testFraction === undefined)
      throw new PlanInputError('The profile takes its test rounds from the log: give the share of rounds the lab marks as test rounds.', 'testFraction');
    requireRange(input.testFraction, 0, 1, 'testFraction', 'The test fraction');
    fixedFraction = input.testFraction;
  } else {
    fixedFraction = selection.mode === 'fixed-fraction' ? selection.fraction : selection.probability;
  }
  const device: PlanDevice = { winFraction, qber, xZeroProbability, trialRate };
  return { device, profile, fixedFraction };
}

function requireRange(value: number, low: number, high: number, field: string, what: string, includeLow = false): void {
  const above = includeLow ? value >= low : value > low;
  if (!(typeof value === 'number' && above && value < high)) {
    throw new PlanInputError(`${what} must be ${includeLow ? 'at least' : 'above'} ${low} and below ${high}; it is ${value}.`, field);
  }
}

/** N from `low` to `high`, `perDecade` points per factor of ten. */
export function logGrid(low: number, high: number, perDecade: number): number[] {
  const steps = Math.round(Math.log10(high / low) * perDecade);
  return Array.from({ length: steps + 1 }, (_, i) => low * 10 ** (i / perDecade));
}

function round6(value: number): number {
  return Math.round(value * 1e6) / 1e6;
}

function cautionsFor(profile: AnalysisProfile): string[] {
  return [
    'Key figures here are estimates against collective (i.i.d.) attacks; final security claims rest on the lab’s own proof, certification and local rules.',
    ...(profile.securityModel === 'general'
      ? ['The profile judges CHSH against ω_thr of the general model; its key length against general attacks, and any positive-key requirement, are planned beside this plan.']
      : []),
    'Pass probabilities take the test-round counts at their expected values; the spread of the counts themselves is left out.',
    `The statistical checks (setting uniformity, no-signalling, drift) are not modelled: on a steady device each fails by chance with about the profile’s significance, ${profile.significance}.`,
    ...(profile.requirePositiveKey ? ['The profile requires a positive key: that is judged at the expected values, not as a probability.'] : []),
  ];
}
