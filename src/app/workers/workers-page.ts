import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';

import type { WorkerDto } from '@shared/api';
import { failureMessage, loaded, readyValue } from '../api/loaded';
import { WORKER_CONDITION_WORDS } from './worker-words';
import { WorkersApi } from './workers-api';
import { ShownDatePipe } from '../dates/shown-dates';

/** The admins' page of analysis workers: who takes jobs, who went silent or ended unasked, what waits. */
@Component({
  selector: 'bk-workers-page',
  imports: [ShownDatePipe, MatIconModule, MatProgressBarModule, MatTableModule],
  templateUrl: './workers-page.html',
  styleUrl: './workers-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkersPage {
  private readonly state = toSignal(loaded(inject(WorkersApi).watch()), { initialValue: { status: 'loading' } });
  protected readonly overview = computed(() => readyValue(this.state()));
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly columns = ['name', 'condition', 'startedAt', 'seenAt', 'endedHow'];

  protected conditionOf(worker: WorkerDto) {
    return WORKER_CONDITION_WORDS[worker.condition];
  }
}
