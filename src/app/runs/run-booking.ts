import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { distinctUntilChanged, from, of, startWith, switchMap } from 'rxjs';

import type { RunDto } from '../../../shared/api';
import { bookingWords, REVEALED_SEED_CAUTION } from '../../../shared/format/booking-words';
import { checkSeedCommitment } from '../bookings/seed-commitment';
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

  protected readonly words = computed(() => bookingWords(this.run()));
  /** The sentences under the headline, run numbers linked; cautions (a replay, a seed already revealed) marked. */
  protected readonly details = computed(() => {
    const run = this.run();
    // The same run without its booking says only what is a caution anyway: a replay.
    const cautions = new Set([REVEALED_SEED_CAUTION, ...bookingWords({ ...run, booking: null }).details]);
    return this.words().details.map((sentence) => ({ parts: runLinkParts(sentence), caution: cautions.has(sentence) }));
  });

  /** The browser's check of the revealed seed against the commitment; null while it computes, or when unbooked. */
  protected readonly check = toSignal(
    toObservable(computed(() => (this.run().booking ? { seed: this.run().seed, commitment: this.run().booking!.seedCommitment } : null))).pipe(
      distinctUntilChanged((first, second) => first?.seed === second?.seed && first?.commitment === second?.commitment),
      switchMap((pair) => (pair === null ? of(null) : from(checkSeedCommitment(pair.seed, pair.commitment)).pipe(startWith(null)))),
    ),
    { initialValue: null },
  );
}
