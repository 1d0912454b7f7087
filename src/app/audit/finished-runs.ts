import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { catchError, of } from 'rxjs';

import type { RunSummaryDto, Verdict } from '@shared/api';
import { type PickedDay, isoDay } from '../dates/local-dates';
import { CardTable } from '../lists/card-table';
import { ChoiceFilter } from '../lists/choice-filter';
import { DateRangeFilter } from '../lists/date-range-filter';
import { FilterBar } from '../lists/filter-bar';
import { setupChoices, VERDICT_CHOICES } from '../lists/filter-choices';
import { ListFrame } from '../lists/list-frame';
import { pagedList } from '../lists/paged-list';
import { ProfilesApi } from '../profiles/profiles-api';
import { RunsApi, type RunQuery } from '../runs/runs-api';
import { BookingNoteLine } from '../runs/booking-note-line';
import { ShortHash } from '../runs/short-hash';
import { VerdictChip } from '../runs/verdict-chip';
import { hexPrefixQuery, hexPrefixValidator, WHILE_TYPING } from './hex-prefix';
import { ShownDatePipe } from '../dates/shown-dates';

/** Finished runs only, the latest nights first. */
const FIRST_PAGE: RunQuery = { page: 0, pageSize: 25, sort: 'acquiredOn', direction: 'desc', finished: true };

/** Every finished run, found by setup, verdict, profile version, night or the start of a hash. Rows open the run. */
@Component({
  selector: 'bk-finished-runs',
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
    MatTableModule,
    ReactiveFormsModule,
    RouterLink,
    ShortHash,
    VerdictChip,
  ],
  templateUrl: './finished-runs.html',
  styleUrl: './audit-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FinishedRuns {
  private readonly runsApi = inject(RunsApi);
  private readonly router = inject(Router);

  protected readonly columns = ['id', 'setup', 'acquiredOn', 'verdict', 'profile', 'fileSha256', 'fingerprint'];
  protected readonly verdicts = VERDICT_CHOICES;
  protected readonly setups = setupChoices();
  protected readonly whileTyping = WHILE_TYPING;

  protected readonly filters = new FormGroup({
    setupId: new FormControl<number | null>(null),
    verdict: new FormControl<Verdict | null>(null),
    profileVersionId: new FormControl<number | null>(null),
    from: new FormControl<PickedDay>(null),
    to: new FormControl<PickedDay>(null),
    sha256: new FormControl<string | null>('', hexPrefixValidator),
    fingerprint: new FormControl<string | null>('', hexPrefixValidator),
  });

  protected readonly profiles = toSignal(
    inject(ProfilesApi)
      .list()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );

  /** Finished runs under the filters; a field with a bad hash prefix holds the list where it was. */
  protected readonly list = pagedList({
    filters: this.filters,
    chosen: () => this.chosenFilters(),
    firstPage: FIRST_PAGE,
    load: (query) => this.runsApi.list(query),
    url: { setupId: 'id', verdict: 'text', profileVersionId: 'id', from: 'day', to: 'day', sha256: 'text', fingerprint: 'text' },
  });

  protected openRun(run: RunSummaryDto): void {
    void this.router.navigate(['/runs', run.id]);
  }

  private chosenFilters(): Partial<RunQuery> {
    const { setupId, verdict, profileVersionId, from, to } = this.filters.getRawValue();
    const { sha256, fingerprint } = this.filters.controls;
    return { setupId, verdict, profileVersionId, from: isoDay(from), to: isoDay(to), sha256: hexPrefixQuery(sha256), fingerprint: hexPrefixQuery(fingerprint) };
  }
}
