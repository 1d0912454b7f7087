/** The protocol a key length is computed for. */
export interface KeyLengthSetting {
  /** Rounds n. */
  rounds: number;
  /** Probability γ that a round is tested. */
  testProbability: number;
  /** Acceptance threshold ω_thr on the win fraction of the test rounds. */
  omegaThreshold: number;
  /** Error-correction syndrome length m in bits. */
  syndromeBits: number;
}

/** The free parameters of the entropy accumulation key length (Nadlinger et al. 2022, Supplementary Proposition 2). */
export interface KeyLengthParameters {
  /** Tangent point t ∈ [¾, ω_max). */
  t: number;
  /** α′ ∈ (1, 2). */
  alphaPrime: number;
  /** α″ ∈ (1, 1 + 1/log2 5). */
  alphaDoublePrime: number;
  /** ε′, with ε′ + 2ε″ < ε_s. */
  epsilonPrime: number;
  /** ε″. */
  epsilonDoublePrime: number;
  /** ε_EA, the entropy accumulation failure probability. */
  epsilonEA: number;
  /** ε_PA, the privacy amplification failure probability. */
  epsilonPA: number;
  /** ε_s, the smoothing parameter. */
  epsilonS: number;
}
