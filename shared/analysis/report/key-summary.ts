import { AnalysisProfile } from '../profile';
import { asymptoticRate } from '../statistics/asymptotic-rate';
import { chshValueFromWinFraction } from '../statistics/chsh-value';
import { finiteKeyLength } from '../statistics/finite-key-length';
import { minEntropyPerRound } from '../statistics/min-entropy';
import { ChshSummary } from './chsh-summary';
import { QberSummary } from './qber-summary';

/** Key figures, all against collective (i.i.d.) attacks. */
export interface KeySummary {
  /** Raw key bits n: generation rounds with the key setting. */
  rawBits: number;
  /** Asymptotic rate per raw bit at the observed S and QBER (Pironio form); ≤ 0 means no key; null without data. */
  asymptoticRate: number | null;
  /** S_low = 8·ω_low − 4 from the Hoeffding-corrected win fraction, or null. */
  chshValueLower: number | null;
  /** Min-entropy per round at S_low, or null. */
  minEntropyPerRound: number | null;
  /** Finite key length ℓ in bits, 0 when ℓ ≤ 0 (no key). */
  finiteKeyBits: number;
}

/** The key figures from the CHSH and error-rate summaries and the profile's f and ε's. */
export function summariseKey(chsh: ChshSummary, qber: QberSummary, profile: AnalysisProfile): KeySummary {
  const rawBits = qber.untestedRounds;
  const chshValueLower = chsh.winFractionLower === null ? null : chshValueFromWinFraction(chsh.winFractionLower);
  const asymptotic = chsh.S === null || qber.rate === null ? null : asymptoticRate(chsh.S, qber.rate);
  const finite =
    chshValueLower === null || qber.untestedRateUpper === null
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
    minEntropyPerRound: chshValueLower === null ? null : minEntropyPerRound(chshValueLower),
    finiteKeyBits: Math.max(0, finite),
  };
}
