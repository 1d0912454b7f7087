import type { AnalysisProfile } from '../analysis/profile';
import { designThreshold } from '../analysis/entropy-accumulation/design-threshold';
import { expectedSiftedProtocol } from '../analysis/report/sifted-protocol';
import { chshValueFromWinFraction } from '../analysis/statistics/chsh-value';
import { LOCAL_WIN_FRACTION } from '../analysis/statistics/bell-bounds';
import type { GeneralPlanSettingsDto, PlanDevice } from '../api/planner';

/** The total soundness assumed when the profile names none (the profile schema's own default). */
const DEFAULT_SOUNDNESS = 1e-10;

/**
 * What the general-attack key length is planned with: the profile's own settings when it has
 * them; otherwise a protocol designed for the expected device (its S and QBER as design values,
 * soundness 1e-10), so a lab on a collective profile sees what the general model would give.
 * γ is the profile's test probability (`bernoulli`), the one its marking uses (`from-log`), or the
 * planned test fraction. Null, with the reason, when no design is possible.
 */
export function generalPlanSettings(profile: AnalysisProfile, device: PlanDevice, testFraction: number): GeneralPlanSettingsDto | { unavailable: string } {
  const settings = profile.generalAttack;
  const testProbability = profile.testSelection.mode === 'from-log' ? (settings?.testProbability ?? testFraction) : testFraction;
  if (settings) {
    const soundness = settings.soundness;
    if (settings.design) return { source: 'profile', soundness, testProbability, design: settings.design, fixed: null };
    return { source: 'profile', soundness, testProbability, design: null, fixed: { omegaThreshold: settings.omegaThreshold!, syndromeBits: settings.syndromeBits! } };
  }
  if (device.winFraction <= LOCAL_WIN_FRACTION) {
    return { unavailable: `An expected win fraction of ${device.winFraction} is at or below the local bound 3/4: no protocol can be designed for it.` };
  }
  if (device.qber <= 0) return { unavailable: 'A design needs an expected QBER above 0.' };
  const design = { chshValue: chshValueFromWinFraction(device.winFraction), qber: device.qber };
  return { source: 'device', soundness: DEFAULT_SOUNDNESS, testProbability, design, fixed: null };
}

/**
 * ω_thr of N log rounds tested with probability γ: the design threshold over the expected
 * sub-protocol (`expectedSiftedProtocol`), or the fixed one.
 */
export function generalThresholdAt(settings: GeneralPlanSettingsDto, logRounds: number, testProbability: number, xZeroProbability: number): number {
  if (!settings.design) return settings.fixed!.omegaThreshold;
  const sifted = expectedSiftedProtocol(logRounds, testProbability, xZeroProbability);
  return designThreshold(sifted.rounds, sifted.testProbability, settings.design.chshValue);
}

/** The profile judged as the general model judges it (the CHSH criterion against ω_thr). */
export function asGeneralProfile(profile: AnalysisProfile): AnalysisProfile {
  return { ...profile, securityModel: 'general' };
}
