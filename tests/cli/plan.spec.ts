import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { GeneralAttackPlanDto, PlanDto } from '@shared/api';
import { winFractionFromChshValue } from '@shared/analysis/statistics/chsh-value';
import { generalKeyPoint, generalPlanProblem, type GeneralPlanProblem } from '@shared/planner/plan-general-attack';
import { planRounds } from '@shared/planner/plan-rounds';
import { ROOT } from './run-analyse';

function runPlan(...args: string[]) {
  const run = spawnSync(path.join(ROOT, 'node_modules/.bin/tsx'), [path.join(ROOT, 'server/cli/plan.ts'), ...args], { cwd: ROOT, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe('plan command', () => {
  let profileFile: string;
  beforeAll(() => {
    profileFile = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-plan-cli-')), 'p.json');
    fs.writeFileSync(profileFile, JSON.stringify({ chshTolerance: 0.03, testSelection: { mode: 'bernoulli', probability: 0.3 } }));
  });
  afterAll(() => fs.rmSync(path.dirname(profileFile), { recursive: true, force: true }));

  it('prints the same plan the shared planner makes, and a summary', () => {
    const run = runPlan('--win', '0.84', '--qber', '0.02', '--profile', profileFile, '--rounds', '2e6', '--rate', '5000');
    expect(run.status).toBe(0);
    const expected = planRounds({ device: { winFraction: 0.84, qber: 0.02, trialRate: 5000 }, profile: JSON.parse(fs.readFileSync(profileFile, 'utf8')), rounds: 2_000_000 });
    expect(JSON.parse(run.stdout)).toEqual(JSON.parse(JSON.stringify(expected)));
    expect(run.stderr).toContain('At 2\u2009000\u2009000 rounds');
    expect(run.stderr).toContain('Acquisition at 5\u2009000 rounds/s: 400 s.');
  });

  it('takes S instead of the win fraction, and plans at the smallest good budget without --rounds', () => {
    const run = runPlan('--s', '2.72', '--qber', '0.02');
    expect(run.status).toBe(0);
    const plan = JSON.parse(run.stdout) as PlanDto;
    expect(plan.device.winFraction).toBeCloseTo(0.84, 12);
    expect(plan.at.rounds).toBe(Math.max(plan.roundsForPositiveKey!, plan.roundsForLikelyPass!));
  });

  it('names a bad input with exit code 2', () => {
    expect(runPlan('--win', '0.84').stderr).toContain('give the expected QBER');
    const bad = runPlan('--win', 'lots', '--qber', '0.02');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('--win must be a number; it is "lots"');
    expect(runPlan('--win', '0.84', '--qber', '0.7').stderr).toContain('The expected QBER must be at least 0 and below 0.5; it is 0.7.');
  });

  describe('with --general, for the published design', () => {
    // Nadlinger et al., Nature 607, 682 (2022), Supplementary Information: n = 1.5e6, γ = 13/256,
    // S = 2.64, QBER 1.8 %, soundness 1e-10 → m = 296 517, ω_thr ≈ 0.825538, 95 884 bits. Here as the
    // sub-protocol of CHSH test and key-setting rounds of N = 8 657 227 log rounds at γ = 13/985.
    const designed = {
      testSelection: { mode: 'bernoulli', probability: 13 / 985 },
      securityModel: 'general',
      generalAttack: { soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } },
    };
    let general: GeneralAttackPlanDto;
    let problem: GeneralPlanProblem;

    beforeAll(() => {
      fs.writeFileSync(profileFile, JSON.stringify(designed));
      const run = runPlan('--s', '2.64', '--qber', '0.018', '--profile', profileFile, '--rounds', '8657227', '--general');
      expect(run.status).toBe(0);
      expect(run.stderr).toContain('Against general attacks (entropy accumulation, an estimate)');
      general = (JSON.parse(run.stdout) as PlanDto & { generalAttack: GeneralAttackPlanDto }).generalAttack;
      problem = generalPlanProblem(
        { device: { winFraction: winFractionFromChshValue(2.64), qber: 0.018 }, profile: designed, rounds: 8_657_227 },
        { roundsForPositiveKey: null, roundsForLikelyPass: null },
      );
    }, 120_000);

    it('reproduces the published key at N and draws a curve that grows with N', () => {
      expect(Math.abs(general.at.bits - 95_884)).toBeLessThanOrEqual(2);
      expect(general.at.sifted.rounds).toBe(1_500_000);
      expect(general.at.sifted.testProbability).toBeCloseTo(13 / 256, 15);
      expect(general.at.syndromeBits).toBe(296_517);
      expect(general.settings.source).toBe('profile');
      const bits = general.curve.map((point) => point.bits);
      expect(bits).toEqual([...bits].sort((a, b) => a - b));
      expect(bits[0]).toBe(0);
      expect(bits[bits.length - 1]).toBeGreaterThan(0);
      general.curve.forEach((point) => expect(point.bits).toBeLessThanOrEqual(point.rounds));
    });

    it('gives the exact smallest N for a key: none one round below it', () => {
      const smallest = general.roundsForPositiveKey!;
      expect(smallest).toBeLessThan(8_657_227);
      expect(generalKeyPoint(problem, smallest).bits).toBeGreaterThan(0);
      expect(generalKeyPoint(problem, smallest - 1).bits).toBe(0);
    }, 60_000);

    it('gives the best γ at N: more key than the profile’s γ, and than a γ 3 % either side', () => {
      const best = general.bestTestProbability!;
      expect(best.bits).toBeGreaterThan(general.at.bits);
      for (const factor of [0.97, 1.03]) expect(generalKeyPoint(problem, 8_657_227, best.testProbability * factor).bits).toBeLessThanOrEqual(best.bits);
    }, 60_000);
  });
});
