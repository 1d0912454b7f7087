import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { CheckResult, CheckStatus, SecuritySummary } from '@shared/analysis';
import { checkFigures } from './check-figures';

/** How each outcome of a check is shown: an icon and a word, the tone only beside them. */
const STATUS_LOOK: Record<CheckStatus, { word: string; icon: string; tone: string }> = {
  pass: { word: 'Pass', icon: 'check_circle', tone: 'bk-tone-accept' },
  warn: { word: 'Warning', icon: 'warning', tone: 'bk-tone-warn' },
  fail: { word: 'Fail', icon: 'cancel', tone: 'bk-tone-abort' },
};

/** The checks of a run: outcome, id and sentence, and for a statistical check its p-value against its share of α. */
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

  protected readonly rows = computed(() => this.checks().map((check) => ({ check, look: STATUS_LOOK[check.status], figures: checkFigures(check, this.security()?.checks) })));
}
