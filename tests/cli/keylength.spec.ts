import { spawnSync } from 'node:child_process';
import path from 'node:path';
import type { GeneralAttackKeyLength } from '@shared/analysis/entropy-accumulation';
import { ROOT } from './run-analyse';

function runKeyLength(...args: string[]) {
  const run = spawnSync(path.join(ROOT, 'node_modules/.bin/tsx'), [path.join(ROOT, 'server/cli/keylength.ts'), ...args], { cwd: ROOT, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

const PUBLISHED_RUN = ['--rounds', '1.5e6', '--gamma', '13/256', '--soundness', '1e-10'];

describe('keylength command', () => {
  it('reproduces the published key length from the design, with its parameters', () => {
    // Nadlinger et al., Nature 607, 682 (2022), arXiv:2109.14600, Supplementary Proposition 2:
    // n = 1.5×10⁶, γ = 13/256, S = 2.64, Q = 1.8 %, soundness 1e-10 → m = 296 517, ω_thr ≈ 0.825538, 95 884 bits.
    const run = runKeyLength(...PUBLISHED_RUN, '--s', '2.64', '--qber', '0.018');
    expect(run.status).toBe(0);
    const printed = JSON.parse(run.stdout) as GeneralAttackKeyLength;
    expect(printed.syndromeBits).toBe(296_517);
    expect(printed.omegaThreshold).toBeCloseTo(0.825538, 6);
    expect(Math.abs(printed.bits - 95_884)).toBeLessThanOrEqual(2);
    expect(Object.keys(printed.parameters).sort()).toEqual(['alphaDoublePrime', 'alphaPrime', 'epsilonDoublePrime', 'epsilonEA', 'epsilonPA', 'epsilonPrime', 'epsilonS', 't']);
    expect(run.stderr).toContain('key bits against general attacks (entropy accumulation)');
  });

  it('takes a fixed threshold and syndrome length instead of the design', () => {
    const run = runKeyLength(...PUBLISHED_RUN, '--omega-thr', '0.8255376291227473', '--syndrome', '296517');
    expect(run.status).toBe(0);
    expect(Math.abs((JSON.parse(run.stdout) as GeneralAttackKeyLength).bits - 95_884)).toBeLessThanOrEqual(2);
  });

  it('answers no key with the reason, exit 0, when the rounds are too few', () => {
    const run = runKeyLength('--rounds', '2e4', '--gamma', '13/256', '--soundness', '1e-10', '--s', '2.64', '--qber', '0.018');
    expect(run.status).toBe(0);
    const printed = JSON.parse(run.stdout) as GeneralAttackKeyLength;
    expect(printed.bits).toBe(0);
    expect(printed.reason).toContain('20\u2009000 rounds give no key');
  });

  it.each([
    [
      'a test probability of 1',
      ['--rounds', '1e6', '--gamma', '1', '--soundness', '1e-10', '--s', '2.64', '--qber', '0.018'],
      'The test probability γ must be above 0 and below 1; it is 1.',
    ],
    [
      'S at the local bound',
      ['--rounds', '1e6', '--gamma', '0.05', '--soundness', '1e-10', '--s', '2', '--qber', '0.018'],
      'The design CHSH value S must be above 2 and at most 2√2 = 2.828427; it is 2.',
    ],
    [
      'S above 2√2',
      ['--rounds', '1e6', '--gamma', '0.05', '--soundness', '1e-10', '--s', '2.83', '--qber', '0.018'],
      'The design CHSH value S must be above 2 and at most 2√2 = 2.828427; it is 2.83.',
    ],
    ['a QBER of ½', ['--rounds', '1e6', '--gamma', '0.05', '--soundness', '1e-10', '--s', '2.64', '--qber', '0.5'], 'The design QBER must be above 0 and below 0.5; it is 0.5.'],
    ['a QBER of 0', ['--rounds', '1e6', '--gamma', '0.05', '--soundness', '1e-10', '--s', '2.64', '--qber', '0'], 'The design QBER must be above 0 and below 0.5; it is 0.'],
    ['a number that is not one', ['--rounds', 'many', '--gamma', '0.05', '--soundness', '1e-10', '--s', '2.64', '--qber', '0.018'], '--rounds must be a number; it is "many"'],
    ['a missing option', ['--gamma', '0.05', '--soundness', '1e-10', '--s', '2.64', '--qber', '0.018'], 'give the number of rounds (--rounds)'],
    [
      'both the design and the protocol',
      ['--rounds', '1e6', '--gamma', '0.05', '--soundness', '1e-10', '--s', '2.64', '--qber', '0.018', '--syndrome', '5'],
      'give either the design (--s and --qber) or the protocol (--omega-thr and --syndrome), one of them',
    ],
    ['an unknown option', ['--rounds', '1e6', '--gamma', '0.05', '--soundness', '1e-10', '--tangent', '0.8'], "Unknown option '--tangent'"],
  ])('refuses %s with exit 2 and a message', (_case, args, message) => {
    const run = runKeyLength(...args);
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain(`keylength: ${message}`);
  });
});
