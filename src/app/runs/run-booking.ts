import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { catchError, distinctUntilChanged, from, map, of, startWith, switchMap } from 'rxjs';

import type { RunDto } from '@shared/api';
import { bookingWords, REVEALED_SEED_CAUTION } from '@shared/format/booking-words';
import { shownDate } from '../dates/shown-dates';
import { checkSeedCommitment, type CommitmentCheck } from '../bookings/seed-commitment';
import { CopyButton } from '../clipboard/copy-button';
import { runLinkParts } from './run-link-parts';

/**
 * How the run came to its seed, in the words of the mail and the PDF: booked (attempt k of n, the
 * other attempts linked, the replacement's reason) with the revealed seed checked in the browser
 * against the commitment published at booking, or the unbooked caution; and a replay's flag.
 */
@Component({
  selector: 'bk-run-booking',
  imports: [CopyButton, MatIconModule, RouterLink],
  templateUrl: './run-booking.html',
  styleUrl: './run-booking.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunBooking {
  /** The run. */
  readonly run = input.required<RunDto>();

  protected readonly words = computed(() => bookingWords(this.run(), (night) => shownDate(night, 'day')));
  /** The sentences under the headline, run numbers linked; cautions (a replay, a seed already revealed) marked. */
  protected readonly details = computed(() => {
    const run = this.run();
    // The same run without its booking says only what is a caution anyway: a replay.
    const cautions = new Set([REVEALED_SEED_CAUTION, ...bookingWords({ ...run, booking: null }).details]);
    return this.words().details.map((sentence) => ({ parts: runLinkParts(sentence), caution: cautions.has(sentence) }));
  });

  /**
   * The browser's check of the revealed seed against the commitment, while it computes and once done;
   * `unavailable` where the browser offers no Web Crypto (a page not served over HTTPS or from localhost).
   */
  private readonly check = toSignal(
    toObservable(computed(() => (this.run().booking ? { seed: this.run().seed, commitment: this.run().booking!.seedCommitment } : null))).pipe(
      distinctUntilChanged((first, second) => first?.seed === second?.seed && first?.commitment === second?.commitment),
      switchMap((pair) =>
        pair === null
          ? of(null)
          : from(checkSeedCommitment(pair.seed, pair.commitment)).pipe(
              map((done): SeedCheck => ({ status: 'done', ...done })),
              catchError(() => of<SeedCheck>({ status: 'unavailable' })),
              startWith<SeedCheck>({ status: 'checking' }),
            ),
      ),
    ),
    { initialValue: null },
  );
  /** The check once done. */
  protected readonly checked = computed(() => {
    const check = this.check();
    return check?.status === 'done' ? check : null;
  });
  protected readonly uncheckable = computed(() => this.check()?.status === 'unavailable');
}

/** Where the browser's check of the seed stands. */
type SeedCheck = { status: 'checking' } | { status: 'unavailable' } | ({ status: 'done' } & CommitmentCheck);
