import type { ProfileDto } from '@shared/api';
import { type AnalysisProfile, parseProfile } from '@shared/analysis';

/** One profile version the planner can plan with. */
export interface ProfileVersionOption {
  readonly id: number;
  /** `name vN`. */
  readonly label: string;
  /** The version's parameters as stored, for `planRounds`. */
  readonly parameters: Record<string, unknown>;
  /** The same, parsed; null when they are not a valid profile (the planner then says why). */
  readonly profile: AnalysisProfile | null;
}

/** Every version of every profile, in the API's order (profiles and versions newest first). */
export function profileVersionOptions(profiles: readonly ProfileDto[]): ProfileVersionOption[] {
  return profiles.flatMap((profile) =>
    profile.versions.map((version) => {
      const parsed = parseProfile(version.parameters);
      return { id: version.id, label: `${profile.name} v${version.version}`, parameters: version.parameters, profile: parsed.ok ? parsed.profile : null };
    }),
  );
}

/** Whether the version leaves the test fraction to the lab's own marking in the log. */
export function takesTestRoundsFromLog(option: ProfileVersionOption | undefined): boolean {
  return option?.profile?.testSelection.mode === 'from-log';
}
