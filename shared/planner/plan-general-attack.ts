import { generalAttackKeyLength } from '../analysis/entropy-accumulation';
import type { AnalysisProfile } from '../analysis/profile';
import { expectedSiftedProtocol } from '../analysis/report/sifted-protocol';
import type { GeneralAttackPlanDto, GeneralKeyPoint, GeneralPlanSettingsDto, PlanDevice } from '../api/planner';
import { chshPassProbability } from './criterion-pass';
import { CHSH_SETTING_SHARE } from './expected-counts';
import { asGeneralProfile, generalPlanSettings } from './general-plan-settings';
import { firstIndexWhere } from './monotone-search';
import { logGrid, planPoint, PlanInputError, recommendedRounds, SEARCH_LIMIT, validated, type PlanInput } from './plan-rounds';

/** The general-attack curve starts here: below 10^3 rounds no protocol gives a key. */
const CURVE_START = 1e3;
/** Two points a decade: each costs one full optimisation (about 0.2 s). */
const CURVE_POINTS_PER_DECADE = 2;
/** γ is searched over [10^−4, 0.6] on a log grid, then refined by golden section in ln γ. */
const GAMMA_RANGE = { low: 1e-4, high: 0.6 };
const GAMMA_GRID_POINTS = 12;
const GAMMA_LOG_TOLERANCE = 1e-3;

/** One planning problem: the device, the profile, what the general key is planned with. */
export interface GeneralPlanProblem {
  device: PlanDevice;
  profile: AnalysisProfile;
  settings: GeneralPlanSettingsDto;
  /** The chosen N. */
  rounds: number;
}

/**
 * The problem of a planner input, or the reason there is none. N is the input's, or the budget the
 * collective plan recommends (`recommended`, computed by the caller from `planRounds`).
 */
export function generalPlanProblem(input: PlanInput, recommended: { roundsForPositiveKey: number | null; roundsForLikelyPass: number | null }): GeneralPlanProblem {
  const { device, profile, fixedFraction } = validated(input);
  const settings = generalPlanSettings(profile, device, fixedFraction);
  if ('unavailable' in settings) throw new PlanInputError(settings.unavailable, 'winFraction');
  const rounds = input.rounds ?? recommendedRounds(recommended.roundsForPositiveKey, recommended.roundsForLikelyPass);
  return { device, profile, settings, rounds };
}

/**
 * The general-attack key of N log rounds at γ (`generalAttackKeyLength`, the entropy accumulation
 * bound with every free parameter optimised, over the expected sub-protocol of CHSH test and
 * key-setting generation rounds, `expectedSiftedProtocol`) and the chance a run of the expected
 * device passes: the CHSH win fraction against ω_thr on the expected CHSH test rounds γ·N·⅔, the
 * other criteria as the collective plan models them.
 */
export function generalKeyPoint(problem: GeneralPlanProblem, rounds: number, testProbability = problem.settings.testProbability): GeneralKeyPoint {
  const { device, profile, settings } = problem;
  const sifted = expectedSiftedProtocol(rounds, testProbability, device.xZeroProbability);
  const common = { ...sifted, soundness: settings.soundness };
  const length = settings.design ? generalAttackKeyLength({ ...common, design: settings.design }) : generalAttackKeyLength({ ...common, ...settings.fixed! });
  const chsh = chshPassProbability(Math.round(testProbability * rounds * CHSH_SETTING_SHARE), device.winFraction, asGeneralProfile(profile), length.omegaThreshold);
  const collective = planPoint(device, profile, rounds, testProbability).passProbability;
  const positiveKey = !profile.requirePositiveKey || length.bits > 0 ? 1 : 0;
  return {
    rounds,
    testProbability,
    sifted,
    bits: length.bits,
    syndromeBits: length.syndromeBits,
    omegaThreshold: length.omegaThreshold,
    reason: length.reason ?? null,
    chshPassProbability: chsh,
    passProbability: chsh * collective.qber * collective.minimumTestRounds * positiveKey,
  };
}

/** The general key over N at γ, two points a decade from 10^3 to the search limit. */
export function generalKeyCurve(problem: GeneralPlanProblem): GeneralKeyPoint[] {
  return logGrid(CURVE_START, SEARCH_LIMIT, CURVE_POINTS_PER_DECADE).map((rounds) => generalKeyPoint(problem, Math.round(rounds)));
}

/**
 * The smallest N with a positive general key at γ: the first positive point of the curve, refined
 * to the exact round by bisection (ℓ grows with N).
 */
export function roundsForPositiveGeneralKey(problem: GeneralPlanProblem, curve: GeneralKeyPoint[]): number | null {
  const first = curve.findIndex((point) => point.bits > 0);
  if (first === -1) return null;
  const low = first === 0 ? 1 : curve[first - 1].rounds + 1;
  return firstIndexWhere(low, curve[first].rounds, (rounds) => generalKeyPoint(problem, rounds).bits > 0);
}

/**
 * The γ of most general key at the chosen N: a log grid over [10^−4, 0.6] (the key is 0 at both
 * ends: too few test rounds, or too many rounds spent on testing), then golden section in ln γ
 * between the best grid point's neighbours. Null when no grid point gives a key.
 */
export function bestGeneralTestProbability(problem: GeneralPlanProblem): GeneralKeyPoint | null {
  const at = (logGamma: number) => generalKeyPoint(problem, problem.rounds, Math.exp(logGamma));
  const low = Math.log(GAMMA_RANGE.low);
  const step = (Math.log(GAMMA_RANGE.high) - low) / (GAMMA_GRID_POINTS - 1);
  const grid = Array.from({ length: GAMMA_GRID_POINTS }, (_, i) => at(low + i * step));
  const bestIndex = grid.reduce((top, point, i) => (point.bits > grid[top].bits ? i : top), 0);
  if (grid[bestIndex].bits <= 0) return null;
  let left = low + Math.max(0, bestIndex - 1) * step;
  let right = low + Math.min(GAMMA_GRID_POINTS - 1, bestIndex + 1) * step;
  const ratio = (Math.sqrt(5) - 1) / 2;
  let inner = at(right - ratio * (right - left));
  let outer = at(left + ratio * (right - left));
  let best = [grid[bestIndex], inner, outer].reduce((top, point) => (point.bits > top.bits ? point : top));
  while (right - left > GAMMA_LOG_TOLERANCE) {
    // Keep the better probe; one new evaluation per step.
    if (inner.bits >= outer.bits) {
      right = Math.log(outer.testProbability);
      outer = inner;
      inner = at(right - ratio * (right - left));
      if (inner.bits > best.bits) best = inner;
    } else {
      left = Math.log(inner.testProbability);
      inner = outer;
      outer = at(left + ratio * (right - left));
      if (outer.bits > best.bits) best = outer;
    }
  }
  return best;
}

/** The whole general-attack plan at once (the API and the command line; the screen takes it in steps). */
export function planGeneralAttack(problem: GeneralPlanProblem): GeneralAttackPlanDto {
  const curve = generalKeyCurve(problem);
  return {
    settings: problem.settings,
    at: generalKeyPoint(problem, problem.rounds),
    curve,
    roundsForPositiveKey: roundsForPositiveGeneralKey(problem, curve),
    bestTestProbability: bestGeneralTestProbability(problem),
    cautions: generalPlanCautions(problem.settings),
  };
}

/** What the general-attack plan assumes, in sentences. */
export function generalPlanCautions(settings: GeneralPlanSettingsDto): string[] {
  return [
    'The key length against general attacks is an estimate from the entropy accumulation theorem in one published explicit form; final security claims rest on the lab’s own proof, certification and local rules.',
    settings.source === 'device'
      ? 'The profile has no general-attack settings: the protocol is designed for the expected device (its S and QBER as design values, soundness 1e-10).'
      : 'Syndrome length and threshold come from the profile’s general-attack settings.',
    'The bound is applied to the CHSH test rounds and key-setting generation rounds of the log (about N·(⅔γ + ⅙(1 − γ)) of them, tested with γ′ = 4γ/(1 + 3γ)); the other rounds are set aside by their settings.',
    'Pass probabilities take the CHSH test rounds at their expected number γ·N·⅔; the spread of that number is left out.',
  ];
}
