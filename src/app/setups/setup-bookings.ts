import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import type { BookingDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { ShortHash } from '../runs/short-hash';
import { VerdictChip } from '../runs/verdict-chip';
import { CardTable } from '../lists/card-table';
import { ShownDatePipe } from '../dates/shown-dates';

/** A setup's booked nights: window, planned rounds, profile, the published seed commitment, and the logs that came. */
@Component({
  selector: 'bk-setup-bookings',
  imports: [CardTable, ShownDatePipe, MatIconModule, RouterLink, ShortHash, VerdictChip],
  templateUrl: './setup-bookings.html',
  styleUrl: './setup-bookings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupBookings {
  /** The bookings, newest night first. */
  readonly bookings = input.required<BookingDto[]>();

  protected readonly count = formatCount;
}
