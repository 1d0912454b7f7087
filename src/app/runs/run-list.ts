import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, of, switchMap } from 'rxjs';

import { RUN_SORT_KEYS, RUN_STATES, VERDICTS, type RunSortKey, type RunState, type RunSummaryDto, type Verdict } from '../../../shared/api';
import { formatCount, formatFixed, formatPercent } from '../../../shared/format/numbers';
import { loaded, pageContents } from '../api/loaded';
import { Session } from '../auth/session';
import { SetupsApi } from '../setups/setups-api';
import { UsersApi } from '../users/users-api';
import { BookingNoteLine } from './booking-note-line';
import { RunsApi, type RunQuery } from './runs-api';
import { VerdictChip } from './verdict-chip';
import { lookOfState, lookOfVerdict } from './verdict-look';
import { WinFractionBar } from './win-fraction-bar';

/** The list's first page: newest uploads first. */
const FIRST_PAGE: RunQuery = { page: 0, pageSize: 25, sort: 'createdAt', direction: 'desc' };

/** Every run, newest first, with server-side paging, sorting and filters. Rows open the run. */
@Component({
  selector: 'bk-run-list',
  imports: [
    BookingNoteLine,
    DatePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
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
  protected readonly states = RUN_STATES.map((state) => ({ value: state, label: lookOfState(state).word }));
  protected readonly verdicts = VERDICTS.map((verdict) => ({ value: verdict, label: lookOfVerdict(verdict).word }));
  protected readonly canUpload = this.session.hasAnyRole(['experimentalist']);

  protected readonly filters = new FormGroup({
    setupId: new FormControl<number | null>(null),
    verdict: new FormControl<Verdict | null>(null),
    state: new FormControl<RunState | null>(null),
    from: new FormControl(''),
    to: new FormControl(''),
    uploadedBy: new FormControl<number | null>(null),
  });

  protected readonly query = signal<RunQuery>(FIRST_PAGE);

  protected readonly setups = toSignal(
    inject(SetupsApi)
      .list()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  /** Who may be picked as uploader: the signed-in user, and everyone for an admin (only admins may list users). */
  protected readonly uploaders = toSignal(
    this.session.hasAnyRole(['admin'])
      ? inject(UsersApi)
          .list()
          .pipe(catchError(() => of([])))
      : of(this.session.user() === null ? [] : [this.session.user()!]),
    { initialValue: [] },
  );

  protected readonly page = toSignal(
    toObservable(this.query).pipe(
      debounceTime(0),
      switchMap((query) => loaded(this.runsApi.list(query))),
    ),
    { initialValue: { status: 'loading' } },
  );
  private readonly contents = computed(() => pageContents(this.page()));
  protected readonly rows = computed(() => this.contents().rows);
  protected readonly total = computed(() => this.contents().total);
  protected readonly filtered = computed(() => Object.keys(this.query()).some((key) => !(key in FIRST_PAGE)));

  protected readonly count = formatCount;
  protected readonly fixed = formatFixed;
  protected readonly percent = formatPercent;

  constructor() {
    this.filters.valueChanges.subscribe((values) => {
      const { pageSize, sort, direction } = this.query();
      const chosen = Object.fromEntries(Object.entries(values).filter(([, value]) => value !== null && value !== ''));
      this.query.set({ page: 0, pageSize, sort, direction, ...chosen });
    });
    // The setups page links here with its setup chosen.
    const setupId = Number(inject(ActivatedRoute).snapshot.queryParamMap.get('setupId'));
    if (Number.isInteger(setupId) && setupId > 0) this.filters.controls.setupId.setValue(setupId);
  }

  protected sortBy(sort: Sort): void {
    const key = sort.active as RunSortKey;
    const usable = sort.direction !== '' && RUN_SORT_KEYS.includes(key);
    this.query.update((query) => ({
      ...query,
      page: 0,
      sort: usable ? key : FIRST_PAGE.sort,
      direction: usable ? (sort.direction as 'asc' | 'desc') : FIRST_PAGE.direction,
    }));
  }

  protected turnPage(event: PageEvent): void {
    this.query.update((query) => ({ ...query, page: event.pageIndex, pageSize: event.pageSize }));
  }

  protected clearFilters(): void {
    this.filters.reset();
  }

  protected reload(): void {
    this.query.update((query) => ({ ...query }));
  }

  protected openRun(run: RunSummaryDto): void {
    void this.router.navigate(['/runs', run.id]);
  }
}
