import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { startWith, Subject, switchMap } from 'rxjs';

import type { TrailCheckDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { failureMessage, loaded, readyValue, type Loaded } from '../api/loaded';
import { ShortHash } from '../runs/short-hash';
import { AuditApi } from './audit-api';
import { ShownDatePipe } from '../dates/shown-dates';

/**
 * The system trail checked against its hash chain on request: intact with its count of events and
 * the newest link, or each problem in a sentence naming its link or event.
 */
@Component({
  selector: 'bk-trail-chain-check',
  imports: [ShownDatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, ShortHash],
  templateUrl: './trail-chain-check.html',
  styleUrl: './trail-chain-check.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TrailChainCheck {
  private readonly auditApi = inject(AuditApi);

  private readonly checkRequests = new Subject<void>();

  /** Null until asked: the check recomputes every link of the trail. */
  protected readonly check = toSignal(
    this.checkRequests.pipe(
      switchMap(() => loaded(this.auditApi.trailCheck())),
      startWith(null),
    ),
    { initialValue: null as Loaded<TrailCheckDto> | null },
  );
  protected readonly checking = computed(() => this.check()?.status === 'loading');
  protected readonly failure = computed(() => {
    const check = this.check();
    return check ? failureMessage(check) : '';
  });
  protected readonly outcome = computed(() => {
    const check = this.check();
    return check ? readyValue(check) : null;
  });
  /** Problems found beyond the ones the server lists. */
  protected readonly unlisted = computed(() => {
    const outcome = this.outcome();
    return outcome ? outcome.problemCount - outcome.problems.length : 0;
  });

  protected readonly count = formatCount;

  protected checkNow(): void {
    this.checkRequests.next();
  }
}
