import type { AnalysisResult } from '../result';
import { chshCriterion, GeneralAcceptance } from './verdict';

/** The general-attack protocol a general profile's result is judged by; else null. */
export function generalAcceptanceOf(result: AnalysisResult): GeneralAcceptance | null {
  return result.profile.securityModel === 'general' ? (result.key?.generalAttack ?? null) : null;
}

/** ω_thr of a general-attack profile's result, which replaces ω_Q − tolerance; else undefined. */
export function generalThresholdOf(result: AnalysisResult): number | undefined {
  return generalAcceptanceOf(result)?.omegaThreshold;
}

/** The threshold an analysed result's CHSH win fraction is judged against (see `chshCriterion`). */
export function winThresholdOf(result: AnalysisResult): number {
  return chshCriterion(result.chsh!, result.profile, generalAcceptanceOf(result)).threshold;
}
