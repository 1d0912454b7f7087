import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { type AbstractControl, FormControl, ReactiveFormsModule, type ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';

import { signedRounds } from '@shared/analysis';
import { FINISHED_STATES, STATED_OFFSET_LIMIT, type RunDto, type SetupDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { Session } from '../auth/session';
import { leadsSetup } from '../setups/setup-lead';
import { RunsApi } from './runs-api';

/**
 * A shift lead's re-run of a pair's two station logs at a stated offset, with a written reason:
 * Bellkeep never realigns records on its own. The re-run is a new run of the same files, seed and
 * profile; the page moves to it. Others are told who may do it.
 */
@Component({
  selector: 'bk-realign-form',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './realign-form.html',
  styleUrl: './realign-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RealignForm {
  private readonly runsApi = inject(RunsApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  /** The run of two station logs. */
  readonly run = input.required<RunDto>();
  /** The run's setup (its shift leads may re-run it), or null while it loads. */
  readonly setup = input.required<SetupDto | null>();

  protected readonly limit = STATED_OFFSET_LIMIT;
  /** The offset the run pairs its records at: the stated one, or 0. */
  protected readonly currentOffset = computed(() => this.run().stations?.offset ?? 0);
  protected readonly current = computed(() => signedRounds(this.currentOffset()));

  protected readonly offset = new FormControl<number | null>(null, [
    Validators.required,
    Validators.min(-STATED_OFFSET_LIMIT),
    Validators.max(STATED_OFFSET_LIMIT),
    Validators.pattern(/^-?\d+$/),
    // The empty start is checked before the run is given: only a value is compared with the run's offset.
    (control: AbstractControl<number | null>): ValidationErrors | null => (control.value !== null && control.value === this.currentOffset() ? { current: true } : null),
  ]);
  protected readonly reason = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(2000)] });
  protected readonly saving = signal(false);
  protected readonly failure = signal('');

  protected readonly finished = computed(() => FINISHED_STATES.includes(this.run().state));
  protected readonly leadsSetup = computed(() => leadsSetup(this.session.user(), this.setup()));
  protected readonly leadNames = computed(
    () =>
      this.setup()
        ?.shiftLeads.map((lead) => lead.name)
        .join(', ') || 'a shift lead',
  );

  constructor() {
    // A shift found names its offset: the form starts from it.
    effect(() => {
      const alignment = this.run().result?.stations?.alignment;
      untracked(() => {
        if (alignment?.shifted && this.offset.pristine) this.offset.setValue(alignment.bestOffset);
      });
    });
  }

  protected realign(): void {
    this.reason.setValue(this.reason.value.trim());
    this.offset.updateValueAndValidity();
    const offset = this.offset.value;
    if (this.offset.invalid || this.reason.invalid || offset === null || this.saving()) {
      this.offset.markAsTouched();
      this.reason.markAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set('');
    this.runsApi.realign(this.run().id, { offset, reason: this.reason.value }).subscribe({
      next: (rerun) => {
        this.saving.set(false);
        void this.router.navigate(['/runs', rerun.id]);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(apiErrorMessage(error));
      },
    });
  }
}
