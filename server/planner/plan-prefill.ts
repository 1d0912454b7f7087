import type { AnalysisResult } from '@shared/analysis';
import type { PlanPrefillDto } from '@shared/api';
import type { Models } from '../database/models';
import type { ProfilesService } from '../profiles/profiles.service';
import type { SetupsService } from '../setups/setups.service';

/** Accepted runs pooled for the planner's starting values. */
const POOLED_RUNS = 10;

/**
 * What a setup's latest accepted runs did, pooled: wins over CHSH test rounds, errors over
 * key-setting test rounds, the share of x = 0 over all rounds, and the median round count.
 */
export async function planPrefill(setupId: number, deps: { models: Models; setups: SetupsService; profiles: ProfilesService }): Promise<PlanPrefillDto> {
  const setup = await deps.setups.get(setupId);
  const profileVersion = await deps.profiles.latestVersionOf(setup.defaultProfileId);
  const runs = await deps.models.Run.findAll({ where: { setupId, state: 'accepted' }, order: [['id', 'DESC']], limit: POOLED_RUNS });
  const results = runs.flatMap((run) => (run.result ? [run.result] : [])).filter((result) => result.chsh && result.qber && result.counts);
  const sum = (value: (result: AnalysisResult) => number) => results.reduce((total, result) => total + value(result), 0);
  // Count tables are nested counts[x][y][a][b]: the x = 0 half is table[0].
  const xZero = (table: number[][][][]) => table[0].flat(2).reduce((total, count) => total + count, 0);
  const chshRounds = sum((result) => result.chsh!.rounds);
  const keyRounds = sum((result) => result.qber!.rounds);
  const allRounds = sum((result) => result.input.rounds);
  const roundCounts = results.map((result) => result.input.rounds).sort((a, b) => a - b);
  return {
    setupId,
    profileVersionId: profileVersion.id,
    runIds: runs.map((run) => run.id),
    winFraction: chshRounds === 0 ? null : sum((result) => result.chsh!.wins) / chshRounds,
    qber: keyRounds === 0 ? null : sum((result) => result.qber!.errors) / keyRounds,
    xZeroProbability: allRounds === 0 ? null : sum((result) => xZero(result.counts!.test) + xZero(result.counts!.generation)) / allRounds,
    rounds: roundCounts.length === 0 ? null : roundCounts[Math.floor((roundCounts.length - 1) / 2)],
  };
}
