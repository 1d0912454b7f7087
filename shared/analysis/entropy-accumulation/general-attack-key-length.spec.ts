import { generalAttackKeyLength, GeneralAttackKeyLength, GeneralAttackRequest, KeyLengthInputError } from './general-attack-key-length';
import { protocolSoundness } from './soundness';

const GAMMA = 13 / 256;
const designed = (rounds: number, chshValue: number, qber: number, soundness = 1e-10, testProbability = GAMMA): GeneralAttackRequest => ({
  rounds,
  testProbability,
  soundness,
  design: { chshValue, qber },
});

// Each key length takes a second under jest: the published design, used by several checks, is computed once.
const computed = new Map<string, GeneralAttackKeyLength>();
function keyLength(request: GeneralAttackRequest): GeneralAttackKeyLength {
  const key = JSON.stringify(request);
  if (!computed.has(key)) computed.set(key, generalAttackKeyLength(request));
  return computed.get(key)!;
}
const bitsOf = (request: GeneralAttackRequest) => keyLength(request).bits;

/** Whether each value is larger than the one before. */
const rising = (values: number[]) => values.every((value, i) => i === 0 || value > values[i - 1]);

describe('generalAttackKeyLength', () => {
  it('reproduces the published key length of the 2022 trapped-ion run within 2 bits', () => {
    // Nadlinger et al., Nature 607, 682 (2022), arXiv:2109.14600, Supplementary Proposition 2:
    // n = 1.5×10⁶, γ = 13/256, S = 2.64, Q = 1.8 %, soundness 1e-10 → m = 296 517,
    // ω_thr ≈ 0.825538, 95 884 bits.
    const result = keyLength(designed(1_500_000, 2.64, 0.018));
    expect(result.syndromeBits).toBe(296_517);
    expect(result.omegaThreshold).toBeCloseTo(0.825538, 6);
    expect(Math.abs(result.bits - 95_884)).toBeLessThanOrEqual(2);
    expect(result.reason).toBeUndefined();
    const { epsilonEA, epsilonPA, epsilonS, epsilonPrime, epsilonDoublePrime } = result.parameters;
    expect(protocolSoundness(epsilonEA, epsilonPA, epsilonS)).toBeLessThanOrEqual(1e-10);
    expect(epsilonPrime + 2 * epsilonDoublePrime).toBeLessThan(epsilonS);
  });

  it('gives the same key from the design and from its syndrome length and threshold', () => {
    const fromDesign = keyLength(designed(1_500_000, 2.64, 0.018));
    const fixed = generalAttackKeyLength({
      rounds: 1_500_000,
      testProbability: GAMMA,
      soundness: 1e-10,
      omegaThreshold: fromDesign.omegaThreshold,
      syndromeBits: fromDesign.syndromeBits,
    });
    expect(fixed).toEqual(fromDesign);
  });

  it('grows with the number of rounds, and never exceeds it', () => {
    const rounds = [1.5e6, 3e6, 1e7];
    const bits = rounds.map((n) => bitsOf(designed(n, 2.64, 0.018)));
    expect(rising(bits)).toBe(true);
    bits.forEach((b, i) => expect(b).toBeLessThanOrEqual(rounds[i]));
    // Near-ideal devices come closest to one bit per round.
    const ideal = bitsOf(designed(1e7, 2.8, 0.001, 1e-3, 0.01));
    expect(ideal).toBeGreaterThan(0.5e7);
    expect(ideal).toBeLessThanOrEqual(1e7);
  });

  it('grows with S and with the soundness budget, and falls with the QBER', () => {
    expect(rising([2.62, 2.64, 2.7].map((s) => bitsOf(designed(1.5e6, s, 0.018))))).toBe(true);
    expect(rising([1e-14, 1e-10, 1e-6].map((e) => bitsOf(designed(1.5e6, 2.64, 0.018, e))))).toBe(true);
    expect(rising([0.025, 0.018, 0.01].map((q) => bitsOf(designed(1.5e6, 2.64, q))))).toBe(true);
  });

  it('rises with the test probability up to its best value and falls beyond it', () => {
    const gammas = [0.03, 0.05, 0.065, 0.08, 0.1, 0.13];
    const bits = gammas.map((gamma) => bitsOf(designed(1.5e6, 2.64, 0.018, 1e-10, gamma)));
    const best = bits.indexOf(Math.max(...bits));
    expect(best).toBeGreaterThan(0);
    expect(best).toBeLessThan(gammas.length - 1);
    expect(rising(bits.slice(0, best + 1))).toBe(true);
    expect(rising(bits.slice(best).reverse())).toBe(true);
  });

  it('gives no key, with the reason, when the rounds are too few', () => {
    const result = generalAttackKeyLength(designed(20_000, 2.64, 0.018));
    expect(result.bits).toBe(0);
    expect(result.reason).toMatch(/^20\u2009000 rounds give no key: the [\d\u2009]+ syndrome bits and the finite-size costs exceed the entropy certified at ω_thr = 0\.\d{6}/);
  });

  it('gives no key, with the reason, for a threshold at or below the local bound', () => {
    const result = generalAttackKeyLength({ rounds: 1e6, testProbability: 0.1, soundness: 1e-10, omegaThreshold: 0.74, syndromeBits: 0 });
    expect(result.bits).toBe(0);
    expect(result.reason).toBe('The threshold ω_thr = 0.740000 is at or below the local bound 3/4: a run that passes it certifies no entropy.');
  });

  it.each<[string, GeneralAttackRequest, string]>([
    ['testProbability', designed(1e6, 2.64, 0.018, 1e-10, 1), 'The test probability γ must be above 0 and below 1; it is 1.'],
    ['design.chshValue', designed(1e6, 2, 0.018), 'The design CHSH value S must be above 2 and at most 2√2 = 2.828427; it is 2.'],
    ['design.chshValue', designed(1e6, 2.9, 0.018), 'The design CHSH value S must be above 2 and at most 2√2 = 2.828427; it is 2.9.'],
    ['design.qber', designed(1e6, 2.64, 0.5), 'The design QBER must be above 0 and below 0.5; it is 0.5.'],
    ['design.qber', designed(1e6, 2.64, 0), 'The design QBER must be above 0 and below 0.5; it is 0.'],
    ['rounds', designed(1.5, 2.64, 0.018), 'The number of rounds must be a whole number of at least 1; it is 1.5.'],
    ['soundness', designed(1e6, 2.64, 0.018, 0), 'The total soundness ε must be above 1.734723475976807e-18 and below 1; it is 0.'],
    [
      'omegaThreshold',
      { rounds: 1e6, testProbability: 0.1, soundness: 1e-10, omegaThreshold: 0.9, syndromeBits: 0 },
      'The threshold ω_thr must be above 0 and at most the quantum maximum 0.853553; it is 0.9.',
    ],
    [
      'syndromeBits',
      { rounds: 1e6, testProbability: 0.1, soundness: 1e-10, omegaThreshold: 0.82, syndromeBits: -1 },
      'The syndrome length must be a whole number of bits, at least 0; it is -1.',
    ],
  ])('refuses a bad %s', (field, request, message) => {
    let thrown: unknown;
    try {
      generalAttackKeyLength(request);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(KeyLengthInputError);
    expect(thrown).toMatchObject({ message, field });
  });
});
