import { designSyndromeLength } from './design-syndrome-length';
import { designThreshold } from './design-threshold';

// Published design of the 2022 trapped-ion run: Nadlinger et al., Nature 607, 682 (2022),
// arXiv:2109.14600, Supplementary Proposition 2 and its design choices: n = 1.5×10⁶, γ = 13/256,
// S = 2.64, Q = 1.8 % give m = 296 517 and ω_thr ≈ 0.825538.
const ROUNDS = 1_500_000;
const GAMMA = 13 / 256;

describe('designSyndromeLength', () => {
  it('reproduces the published syndrome length', () => {
    expect(designSyndromeLength(ROUNDS, GAMMA, 2.64, 0.018)).toBe(296_517);
  });

  it('grows with the QBER and falls with S', () => {
    expect(designSyndromeLength(ROUNDS, GAMMA, 2.64, 0.03)).toBeGreaterThan(296_517);
    expect(designSyndromeLength(ROUNDS, GAMMA, 2.7, 0.018)).toBeLessThan(296_517);
  });
});

describe('designThreshold', () => {
  it('reproduces the published threshold', () => {
    expect(designThreshold(ROUNDS, GAMMA, 2.64)).toBeCloseTo(0.825538, 6);
  });

  it('approaches the expected win probability (4 + S)/8 as n grows', () => {
    expect(designThreshold(1e12, GAMMA, 2.64)).toBeCloseTo(0.83, 4);
    expect(designThreshold(1e12, GAMMA, 2.64)).toBeLessThan(0.83);
  });
});
