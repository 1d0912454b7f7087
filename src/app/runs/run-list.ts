import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { catchError, of } from 'rxjs';

import { RUN_SORT_KEYS, RUN_STATES, VERDICT_STATES, type RunSortKey, type RunState, type RunSummaryDto, type Verdict } from '@shared/api';
import { formatCount, formatFixed, formatPercent } from '@shared/format/numbers';
import { Session } from '../auth/session';
import { type PickedDay, isoDay } from '../dates/local-dates';
import { CardTable } from '../lists/card-table';
import { ChoiceFilter } from '../lists/choice-filter';
import { DateRangeFilter } from '../lists/date-range-filter';
import { FilterBar } from '../lists/filter-bar';
import { setupChoices, VERDICT_CHOICES } from '../lists/filter-choices';
import { ListFrame } from '../lists/list-frame';
import { pagedList } from '../lists/paged-list';
import { UsersApi } from '../users/users-api';
import { BookingNoteLine } from './booking-note-line';
import { RunsApi, type RunQuery } from './runs-api';
import { VerdictChip } from './verdict-chip';
import { lookOfState } from './verdict-look';
import { WinFractionBar } from './win-fraction-bar';
import { ShownDatePipe } from '../dates/shown-dates';

/** The list's first page: newest uploads first. */
const FIRST_PAGE: RunQuery = { page: 0, pageSize: 25, sort: 'createdAt', direction: 'desc' };

/** Every run, newest first, with server-side paging, sorting and filters. Rows open the run. */
@Component({
  selector: 'bk-run-list',
  imports: [
    BookingNoteLine,
    CardTable,
    ChoiceFilter,
    ShownDatePipe,
    DateRangeFilter,
    FilterBar,
    ListFrame,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    ReactiveFormsModule,
    RouterLink,
    VerdictChip,
    WinFractionBar,
  ],
  templateUrl: './run-list.html',
  styleUrl: './run-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunList {
  private readonly runsApi = inject(RunsApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);

  protected readonly columns = ['verdict', 'id', 'setup', 'acquiredOn', 'winFraction', 'qber', 'chsh', 'finiteKey', 'createdAt', 'signedOff'];
  /** The states of an analysis without its verdict (the verdicts have their own filter). */
  protected readonly states = RUN_STATES.filter((state) => !VERDICT_STATES.includes(state)).map((state) => ({ value: state, label: lookOfState(state).word }));
  protected readonly signOffChoices = [{ value: true as const, label: 'Awaiting sign-off' }];
  protected readonly verdicts = VERDICT_CHOICES;
  protected readonly canUpload = this.session.hasAnyRole(['experimentalist']);

  protected readonly filters = new FormGroup({
    setupId: new FormControl<number | null>(null),
    verdict: new FormControl<Verdict | null>(null),
    state: new FormControl<RunState | null>(null),
    awaitingSignOff: new FormControl<true | null>(null),
    from: new FormControl<PickedDay>(null),
    to: new FormControl<PickedDay>(null),
    uploadedBy: new FormControl<number | null>(null),
  });

  protected readonly setups = setupChoices();
  /** Who may be picked as uploader: the signed-in user, and everyone for an admin (only admins may list users). */
  protected readonly uploaders = toSignal(
    this.session.hasAnyRole(['admin'])
      ? inject(UsersApi)
          .list()
          .pipe(catchError(() => of([])))
      : of(this.session.user() === null ? [] : [this.session.user()!]),
    { initialValue: [] },
  );

  /** Runs under the filters; a day typed only in part holds the list where it was. */
  protected readonly list = pagedList({
    filters: this.filters,
    chosen: () => {
      const { from, to, ...chosen } = this.filters.getRawValue();
      return { ...chosen, from: isoDay(from), to: isoDay(to) };
    },
    firstPage: FIRST_PAGE,
    load: (query) => this.runsApi.list(query),
    // The setups page links here with its setup chosen, a worklist with the runs awaiting sign-off.
    url: { setupId: 'id', verdict: 'text', state: 'text', awaitingSignOff: 'flag', from: 'day', to: 'day', uploadedBy: 'id' },
  });

  protected readonly count = formatCount;
  protected readonly fixed = formatFixed;
  protected readonly percent = formatPercent;

  protected sortBy(sort: Sort): void {
    const key = sort.active as RunSortKey;
    this.list.sortBy(RUN_SORT_KEYS.includes(key) ? key : undefined, sort.direction);
  }

  protected openRun(run: RunSummaryDto): void {
    void this.router.navigate(['/runs', run.id]);
  }
}
