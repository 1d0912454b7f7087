import type { AnalysisProfile } from '@shared/analysis';
import { describeProfile } from '@shared/format/profile-field-labels';

/** One field that reads differently in two versions of a profile; '–' where a version has no such field. */
export interface ProfileDifference {
  label: string;
  from: string;
  to: string;
}

/**
 * What changed from `from` to `to`, field by field, by the labels and values the read-only view
 * shows (so a test fraction replaced by a test probability shows as both, each with a '–').
 */
export function profileDifferences(from: AnalysisProfile, to: AnalysisProfile): ProfileDifference[] {
  const before = new Map(describeProfile(from).map((line) => [line.label, line.value]));
  const after = new Map(describeProfile(to).map((line) => [line.label, line.value]));
  const labels = [...new Set([...before.keys(), ...after.keys()])];
  return labels.flatMap((label) => {
    const old = before.get(label) ?? '–';
    const now = after.get(label) ?? '–';
    return old === now ? [] : [{ label, from: old, to: now }];
  });
}
