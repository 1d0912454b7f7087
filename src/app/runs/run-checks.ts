import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { type AnalysisProfile, CHECK_FAMILIES, type CheckFamily, type CheckResult, type CheckStatus, type SecuritySummary } from '@shared/analysis';
import { SPACE_LIKE_CHECK_ID } from '@shared/analysis/stations/space-like-rule';
import { blockingFamilies } from '@shared/analysis/report/assemble-result';
import { CHECK_FAMILY_LABELS, checkLabel } from '@shared/format/check-labels';
import { checkFigures } from './check-figures';

/** How each outcome of a check is shown: an icon and a word, the tone only beside them. */
const STATUS_LOOK: Record<CheckStatus, { word: string; icon: string; tone: string }> = {
  pass: { word: 'Pass', icon: 'check_circle', tone: 'bk-tone-accept' },
  warn: { word: 'Warning', icon: 'warning', tone: 'bk-tone-warn' },
  fail: { word: 'Fail', icon: 'cancel', tone: 'bk-tone-abort' },
};

/**
 * The statistical tests of a run's log: which of them abort a run under its profile, then each
 * test's outcome, label (its id beside it, small) and sentence, and for a statistical test its
 * p-value against its share of α.
 */
@Component({
  selector: 'bk-run-checks',
  imports: [MatIconModule],
  templateUrl: './run-checks.html',
  styleUrl: './run-checks.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunChecks {
  /** The result's checks. */
  readonly checks = input.required<readonly CheckResult[]>();
  /** The result's security summary, for how the checks share the significance; null when it has none. */
  readonly security = input<SecuritySummary | null | undefined>(null);
  /** The profile the result was judged by, for the tests that abort a run. */
  readonly profile = input.required<AnalysisProfile>();

  /**
   * The tests whose failure aborts the run, in words: the profile's blocking families (with
   * stationarity under collective attacks), and those that always block when they run: the log's
   * integrity, its own test marks, space-like separation when the profile requires it.
   */
  protected readonly aborting = computed(() => {
    const profile = this.profile();
    const ran = (prefix: string) => this.checks().some((check) => check.id.startsWith(prefix));
    const blocking = new Set<CheckFamily>([...blockingFamilies(profile), 'log-integrity', ...(ran('test-marks') ? (['test-marks'] as const) : [])]);
    const families = CHECK_FAMILIES.filter((family) => blocking.has(family)).map((family) => CHECK_FAMILY_LABELS[family]);
    const timing = profile.spaceLikeSeparation === 'required' && ran(SPACE_LIKE_CHECK_ID) ? [checkLabel(SPACE_LIKE_CHECK_ID)] : [];
    return [...families, ...timing].join(', ');
  });

  protected readonly rows = computed(() =>
    this.checks().map((check) => ({ check, label: checkLabel(check.id), look: STATUS_LOOK[check.status], figures: checkFigures(check, this.security()?.checks) })),
  );
}
