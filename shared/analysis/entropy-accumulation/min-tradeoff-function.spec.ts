import fc from 'fast-check';
import { minTradeoffValues } from './min-tradeoff-function';
import { minTradeoffVariance } from './min-tradeoff-variance';
import { tangentAt, tangentValue } from './tangent';

const tangentPoint = fc.double({ min: 0.75, max: 0.85, noNaN: true });
const testProbability = fc.double({ min: 1e-3, max: 0.999, noNaN: true });
const winProbability = fc.double({ min: 0.15, max: 0.85, noNaN: true });

describe('minTradeoffValues', () => {
  it('has mean g_t(ω) under q(ω) = (γ(1−ω), γω, 1−γ)', () => {
    fc.assert(
      fc.property(tangentPoint, testProbability, winProbability, (t, gamma, omega) => {
        const tangent = tangentAt(t);
        const values = minTradeoffValues(tangent, gamma);
        const mean = gamma * (1 - omega) * values.lost + gamma * omega * values.won + (1 - gamma) * values.untested;
        return Math.abs(mean - tangentValue(tangent, omega)) < 1e-9 * Math.max(1, Math.abs(values.lost));
      }),
    );
  });
});

describe('minTradeoffVariance', () => {
  it('equals the two-valued closed form p(1−p)·(η′(t)/γ)², p = γ(1−ω)', () => {
    // f_t takes only f_t(0) (probability p) and g_t(1), and f_t(0) − g_t(1) = (g_t(0) − g_t(1))/γ = −η′(t)/γ.
    fc.assert(
      fc.property(tangentPoint, testProbability, winProbability, (t, gamma, omega) => {
        const tangent = tangentAt(t);
        const lost = gamma * (1 - omega);
        const closedForm = lost * (1 - lost) * (tangent.slope / gamma) ** 2;
        return Math.abs(minTradeoffVariance(minTradeoffValues(tangent, gamma), gamma, omega) - closedForm) <= 1e-9 * closedForm + 1e-12;
      }),
    );
  });
});
