import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { startWith, Subject, switchMap } from 'rxjs';

import type { ResultSignatureDto, VerificationCheck, VerificationDto } from '@shared/api';
import { loaded, type Loaded } from '../api/loaded';
import { RunsApi } from './runs-api';
import { ShownDatePipe } from '../dates/shown-dates';

/** What each check of the verification compares, in words. */
const CHECK_NAMES: Record<VerificationCheck, string> = {
  'result-fingerprint': 'Result digest',
  signature: 'Signature',
  'archive-file': 'Archived log',
  'system-trail': 'System trail',
};

/**
 * Whether a stored result is still what the server signed: the signature it carries, and on
 * request a fresh check of the result, the signature, the archived log's bytes and the system
 * trail's hash chain.
 */
@Component({
  selector: 'bk-run-integrity',
  imports: [ShownDatePipe, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './run-integrity.html',
  styleUrl: './run-integrity.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunIntegrity {
  private readonly runsApi = inject(RunsApi);

  /** The run whose stored result is checked. */
  readonly runId = input.required<number>();
  /** The signature stored with the result, or null when it has none. */
  readonly signature = input.required<ResultSignatureDto | null>();

  private readonly checkRequests = new Subject<void>();

  /** Null until asked; the check re-hashes the whole archived log, so never on page load. */
  protected readonly verification = toSignal(
    toObservable(this.runId).pipe(
      switchMap((id) =>
        this.checkRequests.pipe(
          switchMap(() => loaded(this.runsApi.verify(id))),
          startWith(null),
        ),
      ),
    ),
    { initialValue: null as Loaded<VerificationDto> | null },
  );
  protected readonly checking = computed(() => this.verification()?.status === 'loading');
  protected readonly failure = computed(() => {
    const verification = this.verification();
    return verification?.status === 'failed' ? verification.message : '';
  });
  protected readonly outcome = computed(() => {
    const verification = this.verification();
    return verification?.status === 'ready' ? verification.value : null;
  });
  protected readonly failedChecks = computed(() => this.outcome()?.checks.filter((check) => !check.passed).length ?? 0);

  /** A check in words; one this client does not know yet is shown by its name. */
  protected checkName(check: string): string {
    return CHECK_NAMES[check as VerificationCheck] ?? check;
  }

  protected checkNow(): void {
    this.checkRequests.next();
  }
}
