import { keyLengthBudget } from './key-length-budget';
import { KeyLengthParameters } from './key-length-parameters';
import { rateFunction } from './rate-function';

const SETTING = { rounds: 1_500_000, testProbability: 13 / 256, omegaThreshold: 0.825538, syndromeBits: 296_517 };
const PARAMETERS: KeyLengthParameters = {
  t: 0.8118,
  alphaPrime: 1.0006,
  alphaDoublePrime: 1.0037,
  epsilonPrime: 4.3e-11,
  epsilonDoublePrime: 3.5e-12,
  epsilonEA: 1e-10,
  epsilonPA: 1.3e-13,
  epsilonS: 5e-11,
};

describe('keyLengthBudget', () => {
  it('pays each syndrome bit once', () => {
    const more = keyLengthBudget({ ...SETTING, syndromeBits: SETTING.syndromeBits + 1000 }, PARAMETERS);
    expect(keyLengthBudget(SETTING, PARAMETERS) - more).toBeCloseTo(1000, 6);
  });

  it('pays 5·log2(1/ε_PA) for privacy amplification', () => {
    const tighter = keyLengthBudget(SETTING, { ...PARAMETERS, epsilonPA: PARAMETERS.epsilonPA / 2 });
    expect(keyLengthBudget(SETTING, PARAMETERS) - tighter).toBeCloseTo(5, 6);
  });

  it('never exceeds the asymptotic entropy n·η(ω_thr) less the syndrome', () => {
    const ceiling = SETTING.rounds * rateFunction(SETTING.omegaThreshold) - SETTING.syndromeBits;
    for (const t of [0.76, 0.8, 0.8118, 0.825538, 0.85]) {
      expect(keyLengthBudget(SETTING, { ...PARAMETERS, t })).toBeLessThan(ceiling);
    }
  });
});
