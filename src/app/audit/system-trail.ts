import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, of } from 'rxjs';

import { AUDIT_TARGET_TYPES, type AuditEventDto, type AuditFilter, type AuditQuery, type AuditTargetType } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { type PickedDay, isoDay } from '../dates/local-dates';
import { CardTable } from '../lists/card-table';
import { ChoiceFilter } from '../lists/choice-filter';
import { DateRangeFilter } from '../lists/date-range-filter';
import { FilterBar } from '../lists/filter-bar';
import { ListFrame } from '../lists/list-frame';
import { pagedList } from '../lists/paged-list';
import { trailDetail, trailWords } from '../runs/trail-words';
import { TextWithAddresses } from '../users/text-with-addresses';
import { AuditApi } from './audit-api';
import { ACTION_FAMILIES, TARGET_WORDS, targetWords } from './audit-words';
import { TrailChainCheck } from './trail-chain-check';
import { ShownDatePipe } from '../dates/shown-dates';

const FIRST_PAGE = { page: 0, pageSize: 50 };

/** Everything the system recorded, newest first, narrowed by who, what, on what and when; exported as CSV; checked against its hash chain. */
@Component({
  selector: 'bk-system-trail',
  imports: [
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
    TextWithAddresses,
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
    from: new FormControl<PickedDay>(null),
    to: new FormControl<PickedDay>(null),
  });

  protected readonly actors = toSignal(this.auditApi.actors().pipe(catchError(() => of([]))), { initialValue: [] });

  protected readonly list = pagedList<AuditQuery & typeof FIRST_PAGE, AuditEventDto>({
    filters: this.filters,
    chosen: () => this.chosenFilters(),
    firstPage: FIRST_PAGE,
    load: (query) => this.auditApi.trail(query),
    url: { actorId: 'id', action: 'text', targetType: 'text', targetId: 'text', from: 'day', to: 'day' },
  });
  protected readonly exporting = signal(false);

  protected readonly trailWords = trailWords;
  protected readonly trailDetail = trailDetail;
  protected readonly targetWords = targetWords;

  /** Downloads every line under the filters now applied, not only the page shown. */
  protected exportCsv(): void {
    this.exporting.set(true);
    this.auditApi.exportTrail(this.list.chosen()).subscribe({
      next: () => this.exporting.set(false),
      error: (error: unknown) => {
        this.exporting.set(false);
        this.snackBar.open(`The trail could not be exported. ${apiErrorMessage(error)}`, 'Close');
      },
    });
  }

  private chosenFilters(): AuditFilter {
    const { actorId, action, targetType, targetId, from, to } = this.filters.getRawValue();
    return {
      actorId: actorId ?? undefined,
      action: action ?? undefined,
      targetType: targetType ?? undefined,
      targetId: targetId?.trim(),
      from: isoDay(from),
      to: isoDay(to),
    };
  }
}
