import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, filter, map, of, switchMap } from 'rxjs';

import { VERDICTS, type RunSummaryDto, type Verdict } from '../../../shared/api';
import { loaded, pageContents } from '../api/loaded';
import { ProfilesApi } from '../profiles/profiles-api';
import { RunsApi, type RunQuery } from '../runs/runs-api';
import { BookingNoteLine } from '../runs/booking-note-line';
import { ShortHash } from '../runs/short-hash';
import { VerdictChip } from '../runs/verdict-chip';
import { lookOfVerdict } from '../runs/verdict-look';
import { SetupsApi } from '../setups/setups-api';
import { hexPrefixQuery, hexPrefixValidator, WHILE_TYPING } from './hex-prefix';

/** Finished runs only, the latest nights first. */
const FIRST_PAGE: RunQuery = { page: 0, pageSize: 25, sort: 'acquiredOn', direction: 'desc', finished: true };

/** How long typing may pause before the list is asked for again. */
const TYPING_PAUSE_MILLISECONDS = 300;

/** Every finished run, found by setup, verdict, profile version, night or the start of a hash. Rows open the run. */
@Component({
  selector: 'bk-finished-runs',
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
  protected readonly verdicts = VERDICTS.map((verdict) => ({ value: verdict, label: lookOfVerdict(verdict).word }));
  protected readonly whileTyping = WHILE_TYPING;

  protected readonly filters = new FormGroup({
    setupId: new FormControl<number | null>(null),
    verdict: new FormControl<Verdict | null>(null),
    profileVersionId: new FormControl<number | null>(null),
    from: new FormControl(''),
    to: new FormControl(''),
    sha256: new FormControl<string | null>('', hexPrefixValidator),
    fingerprint: new FormControl<string | null>('', hexPrefixValidator),
  });

  protected readonly setups = toSignal(
    inject(SetupsApi)
      .list()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  protected readonly profiles = toSignal(
    inject(ProfilesApi)
      .list()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );

  /** The filters last applied: a field with a bad hash prefix holds the list where it was. */
  private readonly chosen = toSignal(
    this.filters.valueChanges.pipe(
      debounceTime(TYPING_PAUSE_MILLISECONDS),
      filter(() => this.filters.valid),
      map(() => this.chosenFilters()),
    ),
    { initialValue: {} },
  );
  /** Back to the first page whenever the filters change. */
  private readonly paging = linkedSignal<Partial<RunQuery>, Pick<RunQuery, 'page' | 'pageSize'>>({
    source: this.chosen,
    computation: (_chosen, previous) => ({ page: 0, pageSize: previous?.value.pageSize ?? FIRST_PAGE.pageSize }),
  });
  private readonly reload = signal(0);
  protected readonly query = computed<RunQuery>(() => ({ ...FIRST_PAGE, ...this.paging(), ...this.chosen() }));

  protected readonly page = toSignal(
    toObservable(computed(() => ({ query: this.query(), attempt: this.reload() }))).pipe(switchMap(({ query }) => loaded(this.runsApi.list(query)))),
    { initialValue: { status: 'loading' } },
  );
  private readonly contents = computed(() => pageContents(this.page()));
  protected readonly rows = computed(() => this.contents().rows);
  protected readonly total = computed(() => this.contents().total);
  protected readonly filtered = computed(() => Object.keys(this.chosen()).length > 0);

  protected turnPage(event: PageEvent): void {
    this.paging.set({ page: event.pageIndex, pageSize: event.pageSize });
  }

  protected clearFilters(): void {
    this.filters.reset({ from: '', to: '', sha256: '', fingerprint: '' });
  }

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }

  protected openRun(run: RunSummaryDto): void {
    void this.router.navigate(['/runs', run.id]);
  }

  private chosenFilters(): Partial<RunQuery> {
    const { setupId, verdict, profileVersionId, from, to } = this.filters.getRawValue();
    const { sha256, fingerprint } = this.filters.controls;
    const chosen: Partial<RunQuery> = { setupId, verdict, profileVersionId, from, to, sha256: hexPrefixQuery(sha256), fingerprint: hexPrefixQuery(fingerprint) };
    return Object.fromEntries(Object.entries(chosen).filter(([, value]) => value !== null && value !== ''));
  }
}
