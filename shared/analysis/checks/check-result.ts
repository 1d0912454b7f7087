import { CheckFamily } from '../profile';

/** Outcome of one check. */
export type CheckStatus = 'pass' | 'warn' | 'fail';

/** One check of the run, as reported. */
export interface CheckResult {
  /** Stable id, e.g. `setting-uniformity-x`. */
  id: string;
  /** `pass`; or, when the check does not hold, `fail` if its family blocks the verdict, else `warn`. */
  status: CheckStatus;
  /** The observed value (a p-value for statistical checks), or null when there was nothing to observe. */
  observed: number | null;
  /** The value it is held against. */
  threshold: number | null;
  /** What was found, as a sentence. */
  message: string;
}

/** A check before its status is set by the profile's blocking families. */
export interface CheckFinding {
  id: string;
  family: CheckFamily;
  /** Whether the check holds. */
  holds: boolean;
  /** Whether a failure is only ever a warning (gaps in round indices, say). */
  advisory?: boolean;
  observed: number | null;
  threshold: number | null;
  message: string;
}

/** Sets the status of a finding: a check that does not hold fails when its family blocks the verdict, else warns. */
export function checkStatus(finding: CheckFinding, blocking: readonly CheckFamily[]): CheckResult {
  const blocks = blocking.includes(finding.family) && finding.advisory !== true;
  const status: CheckStatus = finding.holds ? 'pass' : blocks ? 'fail' : 'warn';
  return { id: finding.id, status, observed: finding.observed, threshold: finding.threshold, message: finding.message };
}

/** Formats a p-value for a message. */
export function formatPValue(p: number): string {
  return p < 1e-4 ? p.toExponential(2) : p.toPrecision(3);
}
