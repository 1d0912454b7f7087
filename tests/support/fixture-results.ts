import { DEMO_PROFILES } from '@seeders/data/demo-lab';
import { analyseLog } from '@shared/analysis/node';
import type { AnalysisProfileInput } from '@shared/analysis/profile';
import type { AnalysisResult } from '@shared/analysis/result';
import { fixture, SEED } from '../cli/run-analyse';

/** The demo lab's everyday profile. */
export const NIGHTLY = DEMO_PROFILES.find((profile) => profile.name === 'Nightly standard')!;

/** A profile judged under the general-attack model (round-by-round testing, soundness 1e-10). */
export const GENERAL_PROFILE: AnalysisProfileInput = {
  testSelection: { mode: 'bernoulli', probability: 0.5 },
  securityModel: 'general',
  generalAttack: { soundness: 1e-10, design: { chshValue: 2.64, qber: 0.018 } },
};

/** The engine's result for a fixture log under a profile (the nightly one unless told), with the fixed test seed. */
export function analysedFixture(log: string, profile: AnalysisProfileInput = NIGHTLY.parameters): Promise<AnalysisResult> {
  return analyseLog({ path: fixture(log) }, { profile, seed: SEED });
}
