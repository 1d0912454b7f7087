import { formatPValue } from '../../format/numbers';
import { CheckFamily } from '../profile';

/** Outcome of one check. */
export type CheckStatus = 'pass' | 'warn' | 'fail';

/** One check of the run, as reported. */
export interface CheckResult {
  /** Stable id, e.g. `setting-uniformity-x`. */
  id: string;
  /** `pass`; or, when the check does not hold, `fail` if it blocks the verdict, else `warn`. */
  status: CheckStatus;
  /** The observed value (a p-value for statistical checks), or null when there was nothing to observe. */
  observed: number | null;
  /** log10 of the p-value of a statistical check, computed in log space (so it never reads 0); else null. */
  log10PValue: number | null;
  /** The value it is held against (for statistical checks, the profile's significance shared among them). */
  threshold: number | null;
  /** What was found, as a sentence. */
  message: string;
}

/** A check before its status is set by the profile's blocking families. */
export interface CheckFinding {
  id: string;
  /** The family the profile's blocking list names; null for a check whose own profile field decides its blocking (`alwaysBlocks`). */
  family: CheckFamily | null;
  /** Whether the check holds. */
  holds: boolean;
  /** Whether a failure always blocks ACCEPT, whatever the profile's blocking families (soundness checks). */
  alwaysBlocks?: boolean;
  observed: number | null;
  log10PValue?: number;
  threshold: number | null;
  message: string;
}

/** Sets the status of a finding: a check that does not hold fails when it blocks the verdict, else warns. */
export function checkStatus(finding: CheckFinding, blocking: readonly CheckFamily[]): CheckResult {
  const blocks = finding.alwaysBlocks === true || (finding.family !== null && blocking.includes(finding.family));
  const status: CheckStatus = finding.holds ? 'pass' : blocks ? 'fail' : 'warn';
  return { id: finding.id, status, observed: finding.observed, log10PValue: finding.log10PValue ?? null, threshold: finding.threshold, message: finding.message };
}

/** A statistical finding: holds when its p-value reaches the check's share of the significance. */
export function statisticalFinding(
  fields: Omit<CheckFinding, 'holds' | 'observed' | 'threshold' | 'log10PValue' | 'message'>,
  log10PValue: number,
  significance: number,
  message: (holds: boolean, p: string) => string,
): CheckFinding {
  const holds = log10PValue >= Math.log10(significance);
  return { ...fields, holds, observed: 10 ** log10PValue, log10PValue, threshold: significance, message: message(holds, formatPValue(log10PValue)) };
}
