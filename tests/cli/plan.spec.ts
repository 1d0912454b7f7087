import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { planRounds } from '../../shared/planner/plan-rounds';
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
    const plan = JSON.parse(run.stdout);
    expect(plan.device.winFraction).toBeCloseTo(0.84, 12);
    expect(plan.at.rounds).toBe(Math.max(plan.roundsForPositiveKey, plan.roundsForLikelyPass));
  });

  it('names a bad input with exit code 2', () => {
    expect(runPlan('--win', '0.84').stderr).toContain('give the expected QBER');
    const bad = runPlan('--win', 'lots', '--qber', '0.02');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('--win must be a number; it is "lots"');
    expect(runPlan('--win', '0.84', '--qber', '0.7').stderr).toContain('The expected QBER must be at least 0 and below 0.5; it is 0.7.');
  });
});
