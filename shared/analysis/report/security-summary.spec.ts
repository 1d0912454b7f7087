import { analyseRounds } from '@fixtures/adversaries/analyse-rounds';
import { honestQuantum } from '@fixtures/adversaries';

const seed = 'e7'.repeat(32);
const rounds = [...honestQuantum({ rounds: 60_000, visibility: 0.99, qber: 0.01, marks: { probability: 0.2 } }, 'f1'.repeat(32))];

describe('the ε bookkeeping of a result', () => {
  it('adds the four failure probabilities of the collective key figure (union bound)', () => {
    const result = analyseRounds(rounds, { epsilon: 1e-9, epsilonEC: 1e-10, epsilonPA: 2e-10 }, seed);
    expect(result.security!.model).toBe('collective');
    expect(result.security!.keyEpsilon).toBeCloseTo(2e-9 + 1e-10 + 2e-10, 22);
    expect(result.security!.terms.map((term) => term.symbol)).toEqual(['ε', 'ε', 'ε_EC', 'ε_PA']);
  });

  it.each([
    ['seeded selection', {}, 8],
    ['the log’s own marks', { testSelection: { mode: 'from-log' } }, 11],
    [
      'the log’s own marks with a declared γ',
      { testSelection: { mode: 'from-log' }, securityModel: 'general', generalAttack: { design: { chshValue: 2.7, qber: 0.02 }, testProbability: 0.2 } },
      12,
    ],
  ])('shares the significance among exactly the statistical checks it runs (%s: %i)', (_, profile, count) => {
    const result = analyseRounds(rounds, { ...profile, significance: 0.003 }, seed);
    const statistical = result.checks.filter((check) => check.log10PValue !== null);
    expect(statistical).toHaveLength(count);
    expect(result.security!.checks).toMatchObject({ significance: 0.003, count, perCheck: 0.003 / count });
    for (const check of statistical) expect(check.threshold).toBe(0.003 / count);
  });

  it('states the general model’s soundness, split by the optimiser, as its key figure’s ε', () => {
    const result = analyseRounds(
      rounds,
      { testSelection: { mode: 'bernoulli', probability: 0.2 }, securityModel: 'general', generalAttack: { soundness: 1e-8, design: { chshValue: 2.7, qber: 0.02 } } },
      seed,
    );
    const { keyEpsilon, terms } = result.security!;
    expect(keyEpsilon).toBe(1e-8);
    const value = (symbol: string) => terms.find((term) => term.symbol === symbol)!.value;
    // Nadlinger et al. 2022: soundness = max(ε_EA, ε_PA + 2ε_s) + 4ε_h must not exceed the total.
    expect(Math.max(value('ε_EA'), value('ε_PA') + 2 * value('ε_s')) + 4 * value('ε_h')).toBeLessThanOrEqual(1e-8);
  });
});
