/**
 * The protocol the entropy accumulation bound is proved for (Nadlinger et al., Nature 607, 682
 * (2022), Supplementary Information) has two kinds of round: test rounds, each a CHSH game, and
 * generation rounds with the key setting x = 0, y = 2. Bellkeep's logs draw the settings of every
 * round at random (x uniform over {0, 1}, y over {0, 1, 2}, which the setting-uniformity checks
 * verify), tested or not. The bound is applied to the sub-protocol the log contains: its CHSH test
 * rounds and its key-setting generation rounds; the other rounds are set aside by their public
 * settings, drawn by the stations' trusted generators. This mapping is Bellkeep's own reading (not
 * a published rule); it keeps the key within the raw key, which the bound on all rounds would not.
 */

/** Share of the rounds with y ∈ {0, 1}, the CHSH settings: y is uniform over 0, 1, 2. */
export const CHSH_SETTING_SHARE = 2 / 3;
/** Share of the rounds with the key setting x = 0, y = 2: ½ · ⅓. */
export const KEY_SETTING_SHARE = 1 / 6;

/** The sub-protocol's rounds n′ and test probability γ′. */
export interface SiftedProtocol {
  rounds: number;
  testProbability: number;
}

/**
 * γ′ = ⅔γ / (⅔γ + ⅙(1 − γ)) = 4γ / (1 + 3γ): the probability that a round of the sub-protocol is a
 * test round, for a log that tests each round with probability γ.
 */
export function siftedTestProbability(testProbability: number): number {
  const test = CHSH_SETTING_SHARE * testProbability;
  return test / (test + KEY_SETTING_SHARE * (1 - testProbability));
}

/** The sub-protocol of a run: its CHSH test rounds plus its key-setting generation rounds, and γ′. */
export function siftedProtocol(chshTestRounds: number, keyGenerationRounds: number, testProbability: number): SiftedProtocol {
  return { rounds: chshTestRounds + keyGenerationRounds, testProbability: siftedTestProbability(testProbability) };
}

/**
 * The sub-protocol expected of N log rounds tested with probability γ, P(x = 0) = p₀:
 * n′ = N·(⅔γ + (1 − γ)·p₀/3), rounded to a whole round.
 */
export function expectedSiftedProtocol(logRounds: number, testProbability: number, xZeroProbability = 0.5): SiftedProtocol {
  const share = CHSH_SETTING_SHARE * testProbability + ((1 - testProbability) * xZeroProbability) / 3;
  return { rounds: Math.round(logRounds * share), testProbability: siftedTestProbability(testProbability) };
}
