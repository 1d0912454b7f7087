import { AnalysisProfile } from '../profile';
import { asymptoticRate } from '../statistics/asymptotic-rate';
import { QUANTUM_CHSH_VALUE } from '../statistics/bell-bounds';
import { chshValueFromWinFraction } from '../statistics/chsh-value';
import { finiteKeyLength } from '../statistics/finite-key-length';
import { minEntropyPerRound } from '../statistics/min-entropy';
import { ChshSummary } from './chsh-summary';
import { GeneralKeySummary, summariseGeneralKey } from './general-key-summary';
import { QberSummary } from './qber-summary';

/** Key figures: against collective (i.i.d.) attacks, and against general attacks when the profile asks. */
export interface KeySummary {
  /** Raw key bits n: generation rounds with the key setting. */
  rawBits: number;
  /** Asymptotic rate per raw bit at the observed S and QBER (Pironio form); ≤ 0 means no key; null without data or when the observed S is above 2√2. */
  asymptoticRate: number | null;
  /** S_low = 8·ω_low − 4 from the Hoeffding-corrected win fraction, or null. */
  chshValueLower: number | null;
  /** Min-entropy per round at S_low, or null. */
  minEntropyPerRound: number | null;
  /** Finite key length ℓ in bits, 0 when ℓ ≤ 0 (no key). */
  finiteKeyBits: number;
  /** Why no collective-attack key was computed, when S_low is above 2√2 (broken data); else null. */
  finiteKeyReason: string | null;
  /** Key length against general attacks (entropy accumulation), when the profile gives its settings; else null. */
  generalAttackBits: number | null;
  generalAttack: GeneralKeySummary | null;
}

/** The key figures from the CHSH and error-rate summaries, the profile's f and ε's, and the run's round count. */
export function summariseKey(chsh: ChshSummary, qber: QberSummary, profile: AnalysisProfile, rounds: number): KeySummary {
  const rawBits = qber.untestedRounds;
  const chshValueLower = chsh.winFractionLower === null ? null : chshValueFromWinFraction(chsh.winFractionLower);
  // Above 2√2 no rate is defined: a figure from it would be taken from a device that cannot exist.
  const asymptotic = chsh.S === null || qber.rate === null || chsh.S > QUANTUM_CHSH_VALUE ? null : asymptoticRate(chsh.S, qber.rate);
  const aboveQuantum = chshValueLower !== null && chshValueLower > QUANTUM_CHSH_VALUE;
  const finite =
    chshValueLower === null || aboveQuantum || qber.untestedRateUpper === null
      ? 0
      : finiteKeyLength({
          rawBits,
          chshValueLower,
          qberUpper: qber.untestedRateUpper,
          reconciliationEfficiency: profile.reconciliationEfficiency,
          epsilonEC: profile.epsilonEC,
          epsilonPA: profile.epsilonPA,
        });
  return {
    rawBits,
    asymptoticRate: asymptotic,
    chshValueLower,
    minEntropyPerRound: chshValueLower === null || aboveQuantum ? null : minEntropyPerRound(chshValueLower),
    finiteKeyBits: Math.max(0, finite),
    finiteKeyReason: aboveQuantum
      ? `The lower bound S = ${chshValueLower.toFixed(4)} is above 2√2, which no quantum device reaches: no min-entropy and no key are computed from it.`
      : null,
    ...generalFigures(summariseGeneralKey({ logRounds: rounds, chshTestRounds: chsh.rounds, keyGenerationRounds: rawBits }, profile)),
  };
}

function generalFigures(general: GeneralKeySummary | null): Pick<KeySummary, 'generalAttackBits' | 'generalAttack'> {
  return { generalAttackBits: general?.bits ?? null, generalAttack: general };
}
