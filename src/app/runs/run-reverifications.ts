import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { startWith, Subject, switchMap } from 'rxjs';

import type { Role } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { Session } from '../auth/session';
import { randomSeed, seedValidator } from './another-seed';
import { lookOfReverification } from './reverification-look';
import { isReverificationRunning, RunsApi } from './runs-api';
import { ShortHash } from './short-hash';
import { ShownDatePipe } from '../dates/shown-dates';

/** Who may ask for a re-analysis: the roles `POST /api/runs/:id/reverifications` admits. */
const MAY_REVERIFY: readonly Role[] = ['auditor', 'admin'];

/**
 * Re-analyses of a run's archived log, kept beside the stored result: how each ended and which
 * fields differ. Auditors and admins ask for a new one; admins may also ask for one with another
 * seed (a fresh draw of test rounds, never replacing the verdict). The list follows it until it settles.
 */
@Component({
  selector: 'bk-run-reverifications',
  imports: [ShownDatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, ReactiveFormsModule, ShortHash],
  templateUrl: './run-reverifications.html',
  styleUrl: './run-reverifications.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunReverifications {
  private readonly runsApi = inject(RunsApi);

  /** The run whose stored result is re-analysed. */
  readonly runId = input.required<number>();

  private readonly reload = signal(0);
  /** Each new request starts the watch again: the list settled before it was made. */
  private readonly requested = new Subject<void>();

  private readonly live = toSignal(
    toObservable(computed(() => ({ id: this.runId(), attempt: this.reload() }))).pipe(
      // One `loading` per run: a new request keeps the list on screen while it is watched again.
      switchMap(({ id }) =>
        loaded(
          this.requested.pipe(
            startWith(undefined),
            switchMap(() => this.runsApi.watchReverifications(id)),
          ),
        ),
      ),
    ),
    { initialValue: { status: 'loading' } },
  );
  protected readonly reverifications = computed(() => {
    const live = this.live();
    return live.status === 'ready' ? live.value : [];
  });
  protected readonly loading = computed(() => this.live().status === 'loading');
  protected readonly loadFailure = computed(() => {
    const live = this.live();
    return live.status === 'failed' ? live.message : '';
  });

  private readonly session = inject(Session);
  protected readonly mayRequest = this.session.hasAnyRole(MAY_REVERIFY);
  /** Whether the user may re-analyse with another seed: admins only (the server refuses others). */
  protected readonly mayChooseSeed = this.session.hasAnyRole(['admin']);
  protected readonly seedFormOpen = signal(false);
  protected readonly seed = new FormControl('', { nonNullable: true, validators: [Validators.required, seedValidator] });
  protected readonly requesting = signal(false);
  protected readonly requestFailure = linkedSignal({ source: this.runId, computation: () => '' });
  protected readonly running = computed(() => this.reverifications().some(isReverificationRunning));

  protected readonly lookOf = lookOfReverification;
  protected readonly isRunning = isReverificationRunning;

  /** A stored or recomputed field as text: numbers and words as they are, anything else as JSON. */
  protected valueText(value: unknown): string {
    if (value === undefined) return '(absent)';
    return typeof value === 'string' || typeof value === 'number' ? String(value) : JSON.stringify(value);
  }

  protected requestReverification(): void {
    this.request(undefined);
  }

  /** Fills the seed field with a fresh seed drawn in the browser. */
  protected drawSeed(): void {
    this.seed.setValue(randomSeed());
  }

  protected requestWithSeed(): void {
    if (this.seed.invalid) {
      this.seed.markAsTouched();
      return;
    }
    this.request(this.seed.value.trim().toLowerCase());
  }

  private request(seed: string | undefined): void {
    this.requesting.set(true);
    this.requestFailure.set('');
    this.runsApi.requestReverification(this.runId(), seed).subscribe({
      next: () => {
        this.requesting.set(false);
        this.seedFormOpen.set(false);
        this.seed.reset();
        this.requested.next();
      },
      error: (error: unknown) => {
        this.requesting.set(false);
        this.requestFailure.set(apiErrorMessage(error));
      },
    });
  }

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }
}
