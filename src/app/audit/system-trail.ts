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
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, debounceTime, map, of, switchMap } from 'rxjs';

import { AUDIT_TARGET_TYPES, type AuditFilter, type AuditQuery, type AuditTargetType } from '../../../shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded, pageContents } from '../api/loaded';
import { trailDetail, trailWords } from '../runs/trail-words';
import { AuditApi } from './audit-api';
import { ACTION_FAMILIES, TARGET_WORDS, targetWords } from './audit-words';
import { TrailChainCheck } from './trail-chain-check';

const FIRST_PAGE = { page: 0, pageSize: 50 };

/** How long typing may pause before the trail is asked for again. */
const TYPING_PAUSE_MILLISECONDS = 300;

/** Everything the system recorded, newest first, narrowed by who, what, on what and when; exported as CSV; checked against its hash chain. */
@Component({
  selector: 'bk-system-trail',
  imports: [
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
    TrailChainCheck,
  ],
  templateUrl: './system-trail.html',
  styleUrl: './audit-tab.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SystemTrail {
  private readonly auditApi = inject(AuditApi);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly columns = ['createdAt', 'actor', 'action', 'target', 'detail'];
  protected readonly families = ACTION_FAMILIES;
  protected readonly targetTypes = AUDIT_TARGET_TYPES.map((type) => ({ value: type, label: TARGET_WORDS[type] }));

  protected readonly filters = new FormGroup({
    actorId: new FormControl<number | null>(null),
    action: new FormControl<string | null>(null),
    targetType: new FormControl<AuditTargetType | null>(null),
    targetId: new FormControl(''),
    from: new FormControl(''),
    to: new FormControl(''),
  });

  protected readonly actors = toSignal(this.auditApi.actors().pipe(catchError(() => of([]))), { initialValue: [] });

  private readonly chosen = toSignal(
    this.filters.valueChanges.pipe(
      debounceTime(TYPING_PAUSE_MILLISECONDS),
      map(() => this.chosenFilters()),
    ),
    { initialValue: {} },
  );
  /** Back to the first page whenever the filters change. */
  private readonly paging = linkedSignal<AuditFilter, typeof FIRST_PAGE>({
    source: this.chosen,
    computation: (_chosen, previous) => ({ page: 0, pageSize: previous?.value.pageSize ?? FIRST_PAGE.pageSize }),
  });
  private readonly reload = signal(0);
  protected readonly query = computed<AuditQuery & typeof FIRST_PAGE>(() => ({ ...this.paging(), ...this.chosen() }));

  protected readonly page = toSignal(
    toObservable(computed(() => ({ query: this.query(), attempt: this.reload() }))).pipe(switchMap(({ query }) => loaded(this.auditApi.trail(query)))),
    { initialValue: { status: 'loading' } },
  );
  private readonly contents = computed(() => pageContents(this.page()));
  protected readonly rows = computed(() => this.contents().rows);
  protected readonly total = computed(() => this.contents().total);
  protected readonly filtered = computed(() => Object.keys(this.chosen()).length > 0);
  protected readonly exporting = signal(false);

  protected readonly trailWords = trailWords;
  protected readonly trailDetail = trailDetail;
  protected readonly targetWords = targetWords;

  protected turnPage(event: PageEvent): void {
    this.paging.set({ page: event.pageIndex, pageSize: event.pageSize });
  }

  protected clearFilters(): void {
    this.filters.reset({ targetId: '', from: '', to: '' });
  }

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }

  /** Downloads every line under the filters now applied, not only the page shown. */
  protected exportCsv(): void {
    this.exporting.set(true);
    this.auditApi.exportTrail(this.chosen()).subscribe({
      next: () => this.exporting.set(false),
      error: (error: unknown) => {
        this.exporting.set(false);
        this.snackBar.open(`The trail could not be exported. ${apiErrorMessage(error)}`, 'Close');
      },
    });
  }

  private chosenFilters(): AuditFilter {
    const { actorId, action, targetType, targetId, from, to } = this.filters.getRawValue();
    const chosen: AuditFilter = {
      actorId: actorId ?? undefined,
      action: action ?? undefined,
      targetType: targetType ?? undefined,
      targetId: targetId?.trim(),
      from: from ?? undefined,
      to: to ?? undefined,
    };
    return Object.fromEntries(Object.entries(chosen).filter(([, value]) => value !== undefined && value !== ''));
  }
}
