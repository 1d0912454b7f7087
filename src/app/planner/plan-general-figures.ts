import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import type { AnalysisProfile } from '@shared/analysis';
import type { GeneralKeyPoint } from '@shared/api';
import { formatCount, formatFixed, formatScientific } from '@shared/format/numbers';
import { SEARCH_LIMIT } from '@shared/planner/plan-rounds';
import type { GeneralPlanProgress } from './general-plan-runner';
import { formatProbability } from './pass-look';

/**
 * The key length against general attacks at the chosen N (entropy accumulation), the smallest N
 * that gives one and the best test probability γ, filled in as the planner's workers finish.
 */
@Component({
  selector: 'bk-plan-general-figures',
  imports: [MatProgressBarModule],
  template: `
    @let plan = known();
    @if (plan === null) {
      <p class="bk-muted" data-testid="plan-general-unavailable">{{ message() }}</p>
    } @else {
      @if (progress().status === 'computing') {
        <mat-progress-bar mode="indeterminate" aria-label="Computing the key against general attacks" />
      }
      <p class="bk-plan-model" data-testid="plan-general-model">
        Attack model: general (any attack the entropy accumulation theorem covers). {{ modelNote() }}
      </p>
      <dl class="bk-plan-figures bk-figure">
        <div class="bk-plan-row">
          <dt>Key at this N</dt>
          <dd data-testid="plan-general-bits">
            @if (plan.at; as at) {
              <strong>{{ count(at.bits) }}</strong> bits{{ at.bits === 0 ? ' (no key)' : '' }}
              <span class="bk-plan-note">
                γ = {{ gamma(at) }}: over the {{ count(at.sifted.rounds) }} expected CHSH test and key-setting rounds, tested with γ′ = {{ fixed(at.sifted.testProbability) }};
                ω_thr = {{ fixed(at.omegaThreshold) }}, syndrome {{ count(at.syndromeBits) }} bits, soundness {{ plan.settings?.soundness }}
              </span>
              @if (at.reason) {
                <span class="bk-plan-note">{{ at.reason }}</span>
              }
            } @else {
              Computing…
            }
          </dd>
        </div>
        <div class="bk-plan-row">
          <dt>Pass probability (ω ≥ ω_thr)</dt>
          <dd data-testid="plan-general-pass">
            @if (plan.at; as at) {
              {{ probability(at.passProbability) }}
              <span class="bk-plan-note">{{ passNote(at) }}</span>
            } @else {
              Computing…
            }
          </dd>
        </div>
        <div class="bk-plan-row">
          <dt>Smallest N for a key</dt>
          <dd data-testid="plan-general-rounds-for-key">
            @if (plan.roundsForPositiveKey !== undefined) {
              {{ plan.roundsForPositiveKey === null ? noBudget : count(plan.roundsForPositiveKey) + ' rounds' }}
            } @else {
              Computing…
            }
          </dd>
        </div>
        <div class="bk-plan-row">
          <dt>Best γ at this N</dt>
          <dd data-testid="plan-general-best-gamma">
            @if (plan.bestTestProbability !== undefined) {
              @if (plan.bestTestProbability; as best) {
                γ = {{ gamma(best) }}: <strong>{{ count(best.bits) }}</strong> bits, pass probability {{ probability(best.passProbability) }}
              } @else {
                No γ gives a key at this N.
              }
            } @else {
              Computing…
            }
          </dd>
        </div>
      </dl>
      <ul class="bk-plan-general-cautions" data-testid="plan-general-cautions">
        @for (caution of plan.cautions ?? []; track caution) {
          <li>{{ caution }}</li>
        }
      </ul>
    }
  `,
  styleUrl: './plan-rows.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanGeneralFigures {
  readonly progress = input.required<GeneralPlanProgress>();
  /** The profile version's parameters, parsed. */
  readonly profile = input.required<AnalysisProfile>();

  /** The plan as far as it is known, or null when there is none (then `message` says why). */
  protected readonly known = computed(() => {
    const progress = this.progress();
    return 'plan' in progress ? progress.plan : null;
  });
  protected readonly message = computed(() => {
    const progress = this.progress();
    return 'message' in progress ? progress.message : '';
  });

  protected readonly modelNote = computed(() =>
    this.profile().securityModel === 'general'
      ? 'This profile judges by the general model: this is the key to quote.'
      : 'This profile judges by collective attacks: shown beside that estimate for comparison.',
  );
  /**
   * What the pass probability is made of: the CHSH criterion against ω_thr alone, and when the
   * profile requires a positive key and none is possible at this N, that this alone fails the run.
   */
  protected passNote(at: GeneralKeyPoint): string {
    const chsh = `CHSH against ω_thr alone: ${formatProbability(at.chshPassProbability)}`;
    return this.profile().requirePositiveKey && at.bits <= 0
      ? `${chsh}; but the profile requires a positive key, and none is possible at this N`
      : `${chsh}; the error rate and the test-round count as in the collective plan`;
  }

  protected readonly noBudget = `No N up to ${formatScientific(SEARCH_LIMIT)} rounds gives one.`;

  protected gamma(point: GeneralKeyPoint): string {
    return formatFixed(point.testProbability, 4);
  }

  protected readonly count = formatCount;
  protected readonly fixed = formatFixed;
  protected readonly probability = formatProbability;
}
