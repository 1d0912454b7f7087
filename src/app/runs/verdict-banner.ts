import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import type { RunDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { verdictSentence } from '@shared/format/verdict-sentence';
import { lookOfState } from './verdict-look';
import { workerWait } from './worker-wait';

/** The sentence under the word of a state without a result; a verdict's is the one the mail and the PDF say (`verdictSentence`). */
const HEADLINES: Record<RunDto['state'], string> = {
  queued: 'The log is archived and waits for an analysis worker.',
  analysing: 'The log is being read and the test rounds audited.',
  accepted: 'Every acceptance criterion holds and no test that aborts a run failed: the raw key may be kept.',
  aborted: 'The run failed its tests: no key is kept from it.',
  invalid: 'The log could not be read as a round log: nothing was tested.',
  failed: 'The analysis stopped before a verdict. The log is archived; the run can be analysed again.',
};

/** How many problems of an invalid log the banner lists. */
const LISTED_PROBLEMS = 5;

/** The verdict across the top of a run: word, icon and tone, then why; or the analysis progress. */
@Component({
  selector: 'bk-verdict-banner',
  imports: [MatIconModule, MatProgressBarModule],
  templateUrl: './verdict-banner.html',
  styleUrl: './verdict-banner.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerdictBanner {
  /** The run, as the API gives it. */
  readonly run = input.required<RunDto>();

  protected readonly look = computed(() => lookOfState(this.run().state));
  protected readonly headline = computed(() => {
    const { state, result } = this.run();
    return result === null ? HEADLINES[state] : verdictSentence(result);
  });
  protected readonly pending = computed(() => this.run().state === 'queued' || this.run().state === 'analysing');
  protected readonly percent = computed(() => Math.round(this.run().progress * 100));
  /** Recomputed with each poll of the pending run, which brings a new run object. */
  protected readonly waiting = computed(() => workerWait(this.run(), Date.now()));
  protected readonly result = computed(() => this.run().result);
  protected readonly problems = computed(() => this.result()?.errors.slice(0, LISTED_PROBLEMS) ?? []);
  protected readonly moreProblems = computed(() => {
    const result = this.result();
    const more = result === null ? 0 : result.errorCount - this.problems().length;
    return more > 0 ? `and ${formatCount(more)} more ${more === 1 ? 'problem' : 'problems'}` : '';
  });
}
