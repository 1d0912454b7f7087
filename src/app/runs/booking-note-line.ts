import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { RunSummaryDto } from '@shared/api';
import { bookingNote } from './booking-note';

/**
 * The booking note under a run's night in a list: "attempt k", or "unbooked" / "replay of N" in
 * the warning tone. No icon: it is no wider than the date above it; the words say it, the amber
 * only marks them.
 */
@Component({
  selector: 'bk-booking-note-line',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (note(); as note) {
      <div class="bk-cell-note" [class.bk-booking-caution]="note.caution" [class.bk-muted]="!note.caution" [attr.data-testid]="'booking-note-' + run().id">{{ note.text }}</div>
    }
  `,
  styles: `
    .bk-booking-caution {
      color: var(--bk-threshold);
    }
  `,
})
export class BookingNoteLine {
  readonly run = input.required<Pick<RunSummaryDto, 'id' | 'bookingId' | 'attempt' | 'replayOf'>>();
  protected readonly note = computed(() => bookingNote(this.run()));
}
