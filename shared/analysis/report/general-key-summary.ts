import { generalAttackKeyLength } from '../entropy-accumulation';
import type { KeyLengthParameters } from '../entropy-accumulation';
import { AnalysisProfile } from '../profile';
import { siftedProtocol } from './sifted-protocol';

/** The key length against general attacks, as a result records it. */
export interface GeneralKeySummary {
  /** ℓ from entropy accumulation, 0 when there is no key. */
  bits: number;
  /** The rounds n′ and test probability γ′ of the sub-protocol it was computed for (see sifted-protocol.ts). */
  rounds: number;
  testProbability: number;
  /** The log's own rounds and test probability γ, from which n′ and γ′ follow. */
  logRounds: number;
  logTestProbability: number;
  soundness: number;
  /** The syndrome length m and the acceptance threshold ω_thr (from the design or the profile). */
  syndromeBits: number;
  omegaThreshold: number;
  /** The free parameters at the maximum. */
  parameters: KeyLengthParameters;
  /** Why there is no key, when bits is 0. */
  reason: string | null;
}

/**
 * The general-attack key length of a run, when the profile gives its settings and tests round by
 * round (Nadlinger et al., Nature 607, 682 (2022), Supplementary Proposition 2; see
 * shared/analysis/entropy-accumulation), over the run's sub-protocol of CHSH test rounds and
 * key-setting generation rounds (`siftedProtocol`). Null otherwise: a fixed-size test subset does
 * not fit the theorem's round-by-round testing.
 */
export function summariseGeneralKey(run: { logRounds: number; chshTestRounds: number; keyGenerationRounds: number }, profile: AnalysisProfile): GeneralKeySummary | null {
  const settings = profile.generalAttack;
  const selection = profile.testSelection;
  if (!settings || selection.mode === 'fixed-fraction') return null;
  const logTestProbability = selection.mode === 'bernoulli' ? selection.probability : settings.testProbability;
  if (logTestProbability === undefined) return null;
  const sifted = siftedProtocol(run.chshTestRounds, run.keyGenerationRounds, logTestProbability);
  if (sifted.rounds < 1) return null;
  const common = { ...sifted, soundness: settings.soundness };
  const length = settings.design
    ? generalAttackKeyLength({ ...common, design: settings.design })
    : generalAttackKeyLength({ ...common, omegaThreshold: settings.omegaThreshold!, syndromeBits: settings.syndromeBits! });
  return {
    ...common,
    logRounds: run.logRounds,
    logTestProbability,
    bits: length.bits,
    syndromeBits: length.syndromeBits,
    omegaThreshold: length.omegaThreshold,
    parameters: length.parameters,
    reason: length.reason ?? null,
  };
}
