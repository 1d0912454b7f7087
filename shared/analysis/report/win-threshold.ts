import type { AnalysisResult } from '../result';
import { chshCriterion } from './verdict';

/** ω_thr of a general-attack profile's result, which replaces ω_Q − tolerance; else undefined. */
export function generalThresholdOf(result: AnalysisResult): number | undefined {
  return result.profile.securityModel === 'general' ? (result.key?.generalAttack?.omegaThreshold ?? undefined) : undefined;
}

/** The threshold an analysed result's CHSH win fraction is judged against (see `chshCriterion`). */
export function winThresholdOf(result: AnalysisResult): number {
  return chshCriterion(result.chsh!, result.profile, generalThresholdOf(result)).threshold;
}
