import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import { FINISHED_STATES, type RunDto, type SetupDto, type SignOffDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { Session } from '../auth/session';
import { leadsSetup } from '../setups/setup-lead';
import { RunsApi } from './runs-api';

/** The shift lead's sign-off of a run: the form for a lead of its setup, the recorded sign-off for everyone. */
@Component({
  selector: 'bk-sign-off-panel',
  imports: [DatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './sign-off-panel.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignOffPanel {
  private readonly runsApi = inject(RunsApi);
  private readonly session = inject(Session);

  /** The run. */
  readonly run = input.required<RunDto>();
  /** The run's setup (its shift leads may sign off), or null while it loads. */
  readonly setup = input.required<SetupDto | null>();
  /** Emits the sign-off once it is recorded. */
  readonly signedOff = output<SignOffDto>();

  protected readonly comment = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(4000)] });
  protected readonly saving = signal(false);
  protected readonly failure = signal('');

  protected readonly finished = computed(() => FINISHED_STATES.includes(this.run().state));
  /** Whether the signed-in user leads the run's setup. */
  protected readonly leadsSetup = computed(() => leadsSetup(this.session.user(), this.setup()));
  protected readonly leadNames = computed(
    () =>
      this.setup()
        ?.shiftLeads.map((lead) => lead.name)
        .join(', ') || 'a shift lead',
  );

  protected signOffRun(): void {
    this.comment.setValue(this.comment.value.trim());
    if (this.comment.invalid) {
      this.comment.markAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set('');
    this.runsApi.signOff(this.run().id, this.comment.value).subscribe({
      next: (signOff) => {
        this.saving.set(false);
        this.signedOff.emit(signOff);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(apiErrorMessage(error));
      },
    });
  }
}
