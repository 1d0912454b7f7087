import type { CheckResult, SecuritySummary } from '@shared/analysis';
import { formatPValue } from '@shared/format/numbers';
import { formatCount, formatScientific } from '@shared/format/numbers';

/** A statistical check's p-value and the share of the significance it is held against. */
export interface CheckFigures {
  /** The p-value from its log10, so a tail below the smallest double never reads 0. */
  readonly pValue: string;
  /** The per-check threshold, `α/k = 1e-3/9 = 1.1e-4`, or the bare value when the sharing is not known. */
  readonly threshold: string;
}

/**
 * The figures of a statistical check, or null for a check without a p-value (the counting checks,
 * and every check of a result stored before engine 2.0, whose p-values may have underflowed to 0).
 */
export function checkFigures(check: CheckResult, sharing: SecuritySummary['checks'] | null | undefined): CheckFigures | null {
  if (typeof check.log10PValue !== 'number') return null;
  const perCheck = formatScientific(check.threshold);
  return {
    pValue: formatPValue(check.log10PValue),
    threshold: sharing ? `α/k = ${formatScientific(sharing.significance)}/${formatCount(sharing.count)} = ${perCheck}` : perCheck,
  };
}
