import fc from 'fast-check';
import { analyseRounds } from '@fixtures/adversaries/analyse-rounds';
import { droppingLosses, localDeterministic, type Marks } from '@fixtures/adversaries';

const hex = (value: number, prefix: string) => `${prefix}${value.toString(16).padStart(64 - prefix.length, '0')}`;

const marksArbitrary: fc.Arbitrary<Marks> = fc.oneof(
  fc.record({ probability: fc.double({ min: 0.05, max: 0.95, noNaN: true }) }),
  fc.record({
    probability: fc.double({ min: 0.05, max: 0.95, noNaN: true }),
    bias: fc.record({ factor: fc.double({ min: 0, max: 1, noNaN: true }), on: fc.constantFrom<'pair-11' | 'lost-rounds'>('pair-11', 'lost-rounds') }),
  }),
);

/** Any local model without memory: a mixture of deterministic strategies, or one that drops its losses. */
const sourceArbitrary = fc.oneof(
  fc.record({ kind: fc.constant('mixture' as const), strategies: fc.uniqueArray(fc.integer({ min: 0, max: 15 }), { minLength: 1, maxLength: 16 }) }),
  fc.record({ kind: fc.constant('dropping' as const), dropLostProbability: fc.double({ min: 0, max: 0.9, noNaN: true }) }),
);

/** Profiles as loose as a lab may write them: no blocking families, the widest tolerances. */
const profileArbitrary = fc.record({
  testSelection: fc.oneof(
    fc.record({ mode: fc.constant('fixed-fraction'), fraction: fc.double({ min: 0.05, max: 0.9, noNaN: true }) }),
    fc.record({ mode: fc.constant('bernoulli'), probability: fc.double({ min: 0.05, max: 0.9, noNaN: true }) }),
    fc.record({ mode: fc.constant('from-log') }),
  ),
  criterion: fc.constantFrom('observed', 'certified'),
  chshTolerance: fc.double({ min: 0.01, max: 0.25, noNaN: true }),
  qberTolerance: fc.double({ min: 0.01, max: 0.5, noNaN: true }),
  epsilon: fc.constantFrom(1e-6, 1e-9, 1e-12),
  minTestRounds: fc.constant(1),
  missingRoundsTolerance: fc.double({ min: 0, max: 0.49, noNaN: true }),
  blockingChecks: fc.constant([]),
});

describe('local models, whatever their marks, deletions and the profile', () => {
  it('never get ACCEPT (3 000 random sources; Bell 1964, CHSH 1969: no local model beats ¾ on the four pairs)', () => {
    fc.assert(
      fc.property(sourceArbitrary, marksArbitrary, profileArbitrary, fc.integer({ min: 500, max: 8_000 }), fc.nat(2 ** 30), (source, marks, profile, rounds, seed) => {
        const options = { rounds, marks };
        const generated =
          source.kind === 'mixture'
            ? localDeterministic({ ...options, strategy: source.strategies }, hex(seed, 'a1'))
            : droppingLosses({ ...options, dropLostProbability: source.dropLostProbability }, hex(seed, 'a1'));
        const log = [...generated];
        if (log.length === 0) return true;
        return analyseRounds(log, profile, hex(seed, 'b2')).verdict !== 'ACCEPT';
      }),
      { numRuns: 3_000, seed: 20261204 },
    );
  });
});
