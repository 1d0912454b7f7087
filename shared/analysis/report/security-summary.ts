import { AnalysisProfile } from '../profile';
import { KeySummary } from './key-summary';

/** One failure probability the run's figures rest on. */
export interface EpsilonTerm {
  /** Its symbol, e.g. `ε_PA`. */
  symbol: string;
  value: number;
  /** What it bounds, in words. */
  usedFor: string;
}

/** The security bookkeeping of a result: what the key figure that counts rests on, and the checks' significance. */
export interface SecuritySummary {
  /** The attack model of the key figure that counts. */
  model: 'collective' | 'general';
  /** The total security parameter of that key figure. */
  keyEpsilon: number;
  /** The terms it is made of. */
  terms: EpsilonTerm[];
  /** How the terms add up to keyEpsilon. */
  rule: string;
  /** How the profile's significance is shared among the statistical checks. */
  checks: { significance: number; count: number; perCheck: number; correction: string };
}

/**
 * The ε bookkeeping. Collective model: the finite key fails only if one of its four bounds fails —
 * the win fraction's lower bound (ε, through S_low), the raw key's error-rate bound (ε, sampling
 * without replacement), error correction (ε_EC) and privacy amplification (ε_PA) — so its security
 * parameter is at most their sum (the union bound; the usual composition of failure probabilities,
 * e.g. Tomamichel, Lim, Gisin, Renner, Nat. Commun. 3, 634 (2012)). General model: the profile's
 * soundness, split by the optimiser as max(ε_EA, ε_PA + 2ε_s) + 4ε_h (Nadlinger et al., Nature 607,
 * 682 (2022), Supplementary Proposition 2). The statistical checks share the significance α by the
 * Bonferroni correction (Dunn, J. Am. Stat. Assoc. 56, 52 (1961)): each at α/k, so an honest run
 * fails any of the k with probability at most α.
 */
export function summariseSecurity(profile: AnalysisProfile, key: KeySummary, statisticalChecks: number): SecuritySummary {
  const checks = {
    significance: profile.significance,
    count: statisticalChecks,
    perCheck: profile.significance / statisticalChecks,
    correction: `Bonferroni: each of the ${statisticalChecks} statistical checks fails below p = α/${statisticalChecks}, so an honest run fails any of them with probability at most α = ${profile.significance}.`,
  };
  const general = key.generalAttack;
  if (profile.securityModel === 'general' && general) {
    const p = general.parameters;
    return {
      model: 'general',
      keyEpsilon: general.soundness,
      terms: [
        { symbol: 'ε_EA', value: p.epsilonEA, usedFor: 'entropy accumulation (the acceptance test and the smooth min-entropy bound)' },
        { symbol: 'ε_PA', value: p.epsilonPA, usedFor: 'privacy amplification' },
        { symbol: 'ε_s', value: p.epsilonS, usedFor: 'smoothing (ε′, 2ε″ and the rest)' },
        { symbol: 'ε_h', value: 2 ** -61, usedFor: 'each of the four hashing steps' },
      ],
      rule: 'soundness = max(ε_EA, ε_PA + 2ε_s) + 4ε_h, at most the profile’s soundness',
      checks,
    };
  }
  const terms: EpsilonTerm[] = [
    { symbol: 'ε', value: profile.epsilon, usedFor: 'the lower bound of the CHSH win fraction (Hoeffding), hence S_low and the min-entropy' },
    { symbol: 'ε', value: profile.epsilon, usedFor: 'the upper bound of the raw key’s error rate (sampling without replacement)' },
    { symbol: 'ε_EC', value: profile.epsilonEC, usedFor: 'error correction' },
    { symbol: 'ε_PA', value: profile.epsilonPA, usedFor: 'privacy amplification' },
  ];
  return {
    model: 'collective',
    keyEpsilon: terms.reduce((sum, term) => sum + term.value, 0),
    terms,
    rule: 'union bound: ε_key ≤ ε + ε + ε_EC + ε_PA',
    checks,
  };
}
