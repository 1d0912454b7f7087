import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import { mayWithdrawUpload, type RunDto, type WithdrawalDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { Session } from '../auth/session';
import { RunsApi } from './runs-api';
import { ShownDatePipe } from '../dates/shown-dates';

/**
 * A mistaken upload, withdrawn: the notice of who withdrew it and why, for everyone; before any
 * sign-off, for its uploader or an admin, the command to withdraw it with a reason.
 */
@Component({
  selector: 'bk-run-withdrawal',
  imports: [ShownDatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './run-withdrawal.html',
  styleUrl: './run-withdrawal.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunWithdrawal {
  private readonly runsApi = inject(RunsApi);
  private readonly session = inject(Session);

  /** The run. */
  readonly run = input.required<RunDto>();
  /** Emits the withdrawal once it is recorded. */
  readonly withdrawn = output<WithdrawalDto>();

  protected readonly reason = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(2000)] });
  protected readonly asking = signal(false);
  protected readonly saving = signal(false);
  protected readonly failure = signal('');

  /** Whether the signed-in person may withdraw this upload now. */
  protected readonly mayWithdraw = computed(() => {
    const run = this.run();
    const user = this.session.user();
    return user !== null && run.withdrawal === null && run.signOff === null && mayWithdrawUpload(run, user);
  });

  protected withdraw(): void {
    this.reason.setValue(this.reason.value.trim());
    if (this.reason.invalid) {
      this.reason.markAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set('');
    this.runsApi.withdraw(this.run().id, { reason: this.reason.value }).subscribe({
      next: (withdrawal) => {
        this.saving.set(false);
        this.asking.set(false);
        this.withdrawn.emit(withdrawal);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(apiErrorMessage(error));
      },
    });
  }
}
