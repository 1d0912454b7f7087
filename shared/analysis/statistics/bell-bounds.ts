/**
 * Quantum maximum of the CHSH win probability, ω_Q = cos²(π/8) = (2 + √2)/4 ≈ 0.853553
 * (Tsirelson, Lett. Math. Phys. 4, 93 (1980)).
 */
export const QUANTUM_WIN_FRACTION = (2 + Math.SQRT2) / 4;

/** Largest CHSH win probability of any local (classical) model, 3/4 (Clauser, Horne, Shimony, Holt, PRL 23, 880 (1969)). */
export const LOCAL_WIN_FRACTION = 3 / 4;

/** Largest CHSH value S of any local model, 2 (CHSH 1969). */
export const LOCAL_CHSH_VALUE = 2;

/** Largest CHSH value S quantum devices can reach, 2√2 (Tsirelson 1980). */
export const QUANTUM_CHSH_VALUE = 2 * Math.SQRT2;
