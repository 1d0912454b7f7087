import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { PlanDto } from '@shared/api';
import type { AnalysisProfile } from '@shared/analysis';
import { formatCount, formatFixed, formatPercent, formatScientific } from '@shared/format/numbers';
import { LIKELY_PASS } from '@shared/planner/plan-rounds';
import { KeyCaution } from '../runs/key-caution';
import { formatDuration } from './duration';
import { formatProbability } from './pass-look';

/** The key a plan expects at the chosen N, the smallest budgets worth taking, and the best test fraction. */
@Component({
  selector: 'bk-plan-figures',
  imports: [KeyCaution],
  template: `
    <dl class="bk-plan-figures bk-figure">
      <div class="bk-plan-row">
        <dt>Expected finite key</dt>
        <dd data-testid="plan-key-bits">
          <strong>{{ count(at().expectedFiniteKeyBits) }}</strong> bits{{ at().expectedFiniteKeyBits === 0 ? ' (no key at this N)' : '' }}
          <span class="bk-plan-note">from {{ count(at().rawKeyBits) }} raw key bits, {{ percent(at().testFraction, 1) }} of the rounds tested</span>
          <bk-key-caution />
        </dd>
      </div>
      <div class="bk-plan-row">
        <dt>Asymptotic key</dt>
        <dd data-testid="plan-asymptotic-bits">
          <strong>{{ count(at().asymptoticKeyBits) }}</strong> bits ({{ fixed(at().asymptoticRate) }} per raw bit): the limit the finite key approaches as N grows
          <bk-key-caution />
        </dd>
      </div>
      <div class="bk-plan-row">
        <dt>Acquiring N rounds</dt>
        <dd data-testid="plan-acquisition">{{ acquisition() }}</dd>
      </div>
      <div class="bk-plan-row">
        <dt>Smallest N for a positive key</dt>
        <dd data-testid="plan-rounds-for-key">
          {{ budget(plan().roundsForPositiveKey) }}
          <bk-key-caution />
        </dd>
      </div>
      <div class="bk-plan-row">
        <dt>Smallest N for a {{ likelyPass }} pass</dt>
        <dd data-testid="plan-rounds-for-pass">{{ budget(plan().roundsForLikelyPass) }}</dd>
      </div>
      <div class="bk-plan-row">
        <dt>Best test fraction at this N</dt>
        <dd data-testid="plan-best-fraction">
          {{ bestFraction() }}
          <span class="bk-plan-note">{{ fractionNote() }}</span>
          <bk-key-caution />
        </dd>
      </div>
    </dl>
  `,
  styleUrl: './plan-rows.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanFigures {
  /** The whole plan. */
  readonly plan = input.required<PlanDto>();
  /** The profile version's parameters, parsed. */
  readonly profile = input.required<AnalysisProfile>();

  protected readonly at = computed(() => this.plan().at);
  protected readonly likelyPass = formatPercent(LIKELY_PASS, 0);

  protected readonly acquisition = computed(() => {
    const { acquisitionSeconds, rounds } = this.at();
    const trialRate = this.plan().device.trialRate;
    return acquisitionSeconds === null || trialRate === null
      ? 'Give the rounds per second to see how long the night must be.'
      : `${formatCount(rounds)} rounds${timeAtRate(acquisitionSeconds, trialRate)}`;
  });

  protected readonly bestFraction = computed(() => {
    const best = this.plan().bestTestFraction;
    return best.expectedFiniteKeyBits <= 0
      ? 'No test fraction gives a positive key at this N.'
      : `${formatPercent(best.testFraction, 1)} tested: ${formatCount(best.expectedFiniteKeyBits)} bits, pass probability ${formatProbability(best.passProbability)}`;
  });

  protected readonly fractionNote = computed(() => {
    const planned = formatPercent(this.at().testFraction, 1);
    return this.profile().testSelection.mode === 'from-log'
      ? `You plan to mark ${planned} of the rounds as test rounds.`
      : `This profile version tests ${planned}; testing another share needs a new version of the profile.`;
  });

  /** A smallest budget, with the time it takes when the rounds per second are known. */
  protected budget(rounds: number | null): string {
    if (rounds === null) return `No N up to ${formatScientific(this.plan().searchLimit)} rounds reaches it.`;
    const trialRate = this.plan().device.trialRate;
    return `${formatCount(rounds)} rounds${trialRate === null ? '' : timeAtRate(rounds / trialRate, trialRate)}`;
  }

  protected readonly count = formatCount;
  protected readonly fixed = formatFixed;
  protected readonly percent = formatPercent;
}

/** " · 3 h 20 min at 2 000 rounds/s". */
function timeAtRate(seconds: number, trialRate: number): string {
  return ` · ${formatDuration(seconds)} at ${formatCount(trialRate)} rounds/s`;
}
