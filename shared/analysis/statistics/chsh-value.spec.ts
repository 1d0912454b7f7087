import { chshValue, chshValueFromWinFraction, correlator } from './chsh-value';

describe('CHSH value', () => {
  it('reaches 2√2 with the ideal quantum correlators ±1/√2', () => {
    // Tsirelson 1980: E00 = E01 = E10 = −E11 = 1/√2 give S = 2√2.
    const e = Math.SQRT1_2;
    expect(chshValue(e, e, e, -e)).toBeCloseTo(2 * Math.SQRT2, 12);
  });

  it('computes a correlator from agreements and disagreements', () => {
    // Definition (CHSH 1969): E = (N_same − N_diff)/(N_same + N_diff): 75 same, 25 different → 0.5.
    expect(correlator(75, 25)).toBe(0.5);
    expect(correlator(0, 0)).toBeNull();
  });

  it('agrees with S = 8ω − 4 when every setting pair has the same number of rounds', () => {
    // 100 rounds per pair; wins: 80, 85, 90 agreements and 70 disagreements on (1,1).
    const s = chshValue(correlator(80, 20)!, correlator(85, 15)!, correlator(90, 10)!, correlator(30, 70)!);
    expect(s).toBeCloseTo(chshValueFromWinFraction((80 + 85 + 90 + 70) / 400), 12);
  });
});
