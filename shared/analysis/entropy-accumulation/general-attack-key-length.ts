import { formatCount } from '../../format/numbers';
import { LOCAL_WIN_FRACTION, QUANTUM_CHSH_VALUE, QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { designSyndromeLength } from './design-syndrome-length';
import { designThreshold } from './design-threshold';
import { lengthWithLogCost } from './length-with-log-cost';
import { KeyLengthParameters, KeyLengthSetting } from './key-length-parameters';
import { optimiseKeyLength } from './optimise-key-length';
import { HASH_FAILURE } from './soundness';

interface CommonRequest {
  /** Rounds n, a whole number ≥ 1. */
  rounds: number;
  /** Probability γ ∈ (0, 1) that a round is tested. */
  testProbability: number;
  /** Total soundness ε, above 4·2^−61 and below 1. */
  soundness: number;
}

/** Syndrome length and threshold from the design equations, at the expected S and QBER. */
export interface DesignedRequest extends CommonRequest {
  design: { chshValue: number; qber: number };
}

/** Syndrome length and threshold as fixed by the protocol. */
export interface FixedRequest extends CommonRequest {
  omegaThreshold: number;
  syndromeBits: number;
}

export type GeneralAttackRequest = DesignedRequest | FixedRequest;

/** The key length against general attacks and what it was computed with. */
export interface GeneralAttackKeyLength {
  /** Extractable key bits ℓ (0 when there is no key). */
  bits: number;
  syndromeBits: number;
  omegaThreshold: number;
  /** The free parameters at the maximum. */
  parameters: KeyLengthParameters;
  /** Why there is no key, when bits is 0. */
  reason?: string;
}

/** A request the key length cannot be computed for; `field` names the input. */
export class KeyLengthInputError extends Error {
  constructor(
    message: string,
    readonly field: string,
  ) {
    super(message);
    this.name = 'KeyLengthInputError';
  }
}

/**
 * Key length against general (coherent) attacks from the entropy accumulation theorem, in the
 * explicit form of Nadlinger et al., Nature 607, 682 (2022), arXiv:2109.14600, Supplementary
 * Proposition 2: ℓ = ⌊Υ(x)⌋, x maximised over t, α′, α″, ε′, ε″ and the split of the total soundness
 * between ε_EA, ε_PA and ε_s, with max(ε_EA, ε_PA + 2ε_s) + 4ε_h ≤ the total. Either the design S
 * and QBER fix the syndrome length m and the threshold ω_thr (that paper's design equations), or
 * the request gives them.
 *
 * @throws KeyLengthInputError for an input out of range.
 */
export function generalAttackKeyLength(request: GeneralAttackRequest): GeneralAttackKeyLength {
  const setting = keyLengthSetting(request);
  const { budget, parameters } = optimiseKeyLength(setting, request.soundness);
  const bits = Math.max(0, Math.floor(lengthWithLogCost(budget)));
  const result = { bits, syndromeBits: setting.syndromeBits, omegaThreshold: setting.omegaThreshold, parameters };
  return bits > 0 ? result : { ...result, reason: noKeyReason(setting, budget) };
}

function keyLengthSetting(request: GeneralAttackRequest): KeyLengthSetting {
  const { rounds, testProbability, soundness } = request;
  if (!(Number.isSafeInteger(rounds) && rounds >= 1)) throw new KeyLengthInputError(`The number of rounds must be a whole number of at least 1; it is ${rounds}.`, 'rounds');
  requireOpenRange(testProbability, 0, 1, 'testProbability', 'The test probability γ');
  requireOpenRange(soundness, 4 * HASH_FAILURE, 1, 'soundness', 'The total soundness ε');
  if ('design' in request) {
    const { chshValue, qber } = request.design;
    if (!(chshValue > 2 && chshValue <= QUANTUM_CHSH_VALUE)) {
      throw new KeyLengthInputError(`The design CHSH value S must be above 2 and at most 2√2 = ${QUANTUM_CHSH_VALUE.toFixed(6)}; it is ${chshValue}.`, 'design.chshValue');
    }
    requireOpenRange(qber, 0, 0.5, 'design.qber', 'The design QBER');
    return {
      rounds,
      testProbability,
      omegaThreshold: designThreshold(rounds, testProbability, chshValue),
      syndromeBits: designSyndromeLength(rounds, testProbability, chshValue, qber),
    };
  }
  const { omegaThreshold, syndromeBits } = request;
  if (!(omegaThreshold > 0 && omegaThreshold <= QUANTUM_WIN_FRACTION)) {
    throw new KeyLengthInputError(
      `The threshold ω_thr must be above 0 and at most the quantum maximum ${QUANTUM_WIN_FRACTION.toFixed(6)}; it is ${omegaThreshold}.`,
      'omegaThreshold',
    );
  }
  if (!(Number.isSafeInteger(syndromeBits) && syndromeBits >= 0))
    throw new KeyLengthInputError(`The syndrome length must be a whole number of bits, at least 0; it is ${syndromeBits}.`, 'syndromeBits');
  return { rounds, testProbability, omegaThreshold, syndromeBits };
}

function requireOpenRange(value: number, low: number, high: number, field: string, what: string): void {
  if (!(value > low && value < high)) throw new KeyLengthInputError(`${what} must be above ${low} and below ${high}; it is ${value}.`, field);
}

function noKeyReason(setting: KeyLengthSetting, budget: number): string {
  if (setting.omegaThreshold <= LOCAL_WIN_FRACTION) {
    return `The threshold ω_thr = ${setting.omegaThreshold.toFixed(6)} is at or below the local bound 3/4: a run that passes it certifies no entropy.`;
  }
  return `${formatCount(setting.rounds)} rounds give no key: the ${formatCount(setting.syndromeBits)} syndrome bits and the finite-size costs exceed the entropy certified at ω_thr = ${setting.omegaThreshold.toFixed(6)} (the bit budget is ${formatCount(budget)}).`;
}
