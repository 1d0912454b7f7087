import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { DeviceModel } from '@fixtures/device-model';
import { writeModelLog } from '@fixtures/model-log-file';
import { analyseLog } from '../analysis/node';
import { chshCriterion, qberCriterion } from '../analysis/report/verdict';
import { planRounds } from './plan-rounds';

/** Simulated runs per scenario: the standard error of an observed pass rate is then at most 0.5/√300 ≈ 0.029. */
const SIMULATED_RUNS = 300;
/** How many standard errors of the simulation the prediction may be off (about 1 in 2000 by chance). */
const ALLOWED_STANDARD_ERRORS = 3.5;

/**
 * The planner against the engine: runs of the invented device model at the planned N, each with
 * its own acquisition and selection seeds, analysed by the engine itself; the share that passes
 * each criterion must match the planner's probability within the simulation's binomial error.
 */
describe('the planner against simulated runs of the device model', () => {
  let scratch: string;
  beforeAll(() => {
    scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-plan-'));
  });
  afterAll(() => fs.rmSync(scratch, { recursive: true, force: true }));

  const scenarios = [
    {
      name: 'observed criteria, fixed half tested',
      rounds: 12_000,
      visibility: 0.95,
      keyError: 0.03,
      profile: { criterion: 'observed', chshTolerance: 0.0207, qberTolerance: 0.0345, minTestRounds: 500 },
    },
    {
      name: 'certified criteria, a quarter tested round by round',
      rounds: 60_000,
      visibility: 0.97,
      keyError: 0.02,
      profile: { testSelection: { mode: 'bernoulli', probability: 0.25 }, criterion: 'certified', epsilon: 1e-3, chshTolerance: 0.03, qberTolerance: 0.058, minTestRounds: 500 },
    },
  ];

  it.each(scenarios)(
    '$name',
    async ({ rounds, visibility, keyError, profile }) => {
      const model: DeviceModel = { rounds, northHallZeroBias: 0.5, visibility: () => visibility, keyError: () => keyError, lossProbability: 0 };
      // The device model wins a CHSH round with probability 1/2 + V·√2/4.
      const plan = planRounds({ device: { winFraction: 0.5 + (visibility * Math.SQRT2) / 4, qber: keyError }, profile, rounds });
      const predicted = plan.at.passProbability;
      // Intermediate probabilities, so that the comparison can fail.
      for (const probability of [predicted.chsh, predicted.qber]) expect(probability).toBeGreaterThan(0.15);
      for (const probability of [predicted.chsh, predicted.qber]) expect(probability).toBeLessThan(0.95);

      let chshPasses = 0;
      let qberPasses = 0;
      const file = path.join(scratch, 'run.csv');
      for (let run = 0; run < SIMULATED_RUNS; run++) {
        const seedOf = (what: string) => crypto.createHash('sha256').update(`planner simulation ${rounds} ${run} ${what}`).digest('hex');
        await writeModelLog(file, model, seedOf('acquisition'));
        const result = await analyseLog({ path: file }, { profile, seed: seedOf('selection'), threads: 1 });
        if (chshCriterion(result.chsh!, result.profile).passes) chshPasses++;
        if (qberCriterion(result.qber!, result.profile).passes) qberPasses++;
      }
      for (const [observed, probability] of [
        [chshPasses / SIMULATED_RUNS, predicted.chsh],
        [qberPasses / SIMULATED_RUNS, predicted.qber],
      ]) {
        const standardError = Math.sqrt((probability * (1 - probability)) / SIMULATED_RUNS);
        expect(Math.abs(observed - probability)).toBeLessThan(ALLOWED_STANDARD_ERRORS * standardError);
      }
    },
    300_000,
  );
});
