import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { of, switchMap } from 'rxjs';

import type { SetupDto } from '@shared/api';
import { failureMessage, loaded, readyValue, type Loaded } from '../api/loaded';
import { Session } from '../auth/session';
import { BookingsApi } from '../bookings/bookings-api';
import { navItem } from '../shell/navigation';
import { AcquisitionRecipePanel } from './acquisition-recipe-panel';
import { SetupBookings } from './setup-bookings';
import { SetupFacts } from './setup-facts';
import { leadsSetup } from './setup-lead';
import { SetupTrendChart } from './setup-trend-chart';
import { SetupsApi } from './setups-api';
import { UploadTokens } from './upload-tokens';

/** One setup: its details and trend, its booked nights, and how its acquisition computer uploads (tokens and the curl recipe). */
@Component({
  selector: 'bk-setup-page',
  imports: [AcquisitionRecipePanel, MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, SetupBookings, SetupFacts, SetupTrendChart, UploadTokens],
  templateUrl: './setup-page.html',
  styleUrl: './setup-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupPage {
  private readonly setupsApi = inject(SetupsApi);
  private readonly bookingsApi = inject(BookingsApi);
  private readonly session = inject(Session);

  /** The setup's id, from the route. */
  readonly id = input.required<string>();

  private readonly reload = signal(0);
  private readonly request = computed(() => ({ id: Number(this.id()), attempt: this.reload() }));

  private readonly setup = toSignal(
    toObservable(this.request).pipe(
      switchMap(({ id }) =>
        Number.isInteger(id) && id > 0 ? loaded(this.setupsApi.get(id)) : of<Loaded<SetupDto>>({ status: 'failed', message: 'There is no setup with this number.' }),
      ),
    ),
    { initialValue: { status: 'loading' } },
  );
  private readonly bookings = toSignal(toObservable(this.request).pipe(switchMap(({ id }) => loaded(this.bookingsApi.list(id)))), {
    initialValue: { status: 'loading' },
  });

  /** The setup once loaded. */
  protected readonly shown = computed(() => readyValue(this.setup()));
  protected readonly failure = computed(() => failureMessage(this.setup()));
  protected readonly bookingList = computed(() => readyValue(this.bookings()));
  protected readonly bookingsFailure = computed(() => failureMessage(this.bookings()));

  /** Whether the user may book nights (from the planner, which they may open). */
  protected readonly mayBook = this.session.hasAnyRole(navItem('planner').roles);
  /** Whether the user keeps the setup's upload tokens: an admin, or one of its shift leads. */
  protected readonly keepsTokens = computed(() => this.session.hasAnyRole(['admin']) || leadsSetup(this.session.user(), this.shown()));

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }
}
