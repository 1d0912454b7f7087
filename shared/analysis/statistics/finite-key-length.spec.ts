import { finiteKeyLength } from './finite-key-length';

describe('finiteKeyLength', () => {
  it('follows the collective-attack formula on a hand-computed case', () => {
    // Computed term by term in Python: n = 10^6, S_low = 2.5 → H_min = 0.2675677 per round
    // (Pironio et al. 2010), Q_up = 0.02 → h = 0.1414405, f = 1.15; ε_EC = ε_PA = 1e-10:
    // 267 567.69 − 162 656.62 − log2(2e10) (34.22) − 2·log2(1e10) (66.44) = 104 810.41 → 104 810.
    const bits = finiteKeyLength({
      rawBits: 1_000_000,
      chshValueLower: 2.5,
      qberUpper: 0.02,
      reconciliationEfficiency: 1.15,
      epsilonEC: 1e-10,
      epsilonPA: 1e-10,
    });
    expect(bits).toBe(104_810);
  });

  it('gives no key when the corrected CHSH value is at the local bound', () => {
    const bits = finiteKeyLength({ rawBits: 1e6, chshValueLower: 2, qberUpper: 0.01, reconciliationEfficiency: 1.1, epsilonEC: 1e-10, epsilonPA: 1e-10 });
    expect(bits).toBeLessThan(0);
  });
});
