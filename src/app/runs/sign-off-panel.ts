import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';

import { FINISHED_STATES, SIGN_OFF_DECISION_WORDS, SIGN_OFF_DECISIONS, type RunDto, type SetupDto, type SignOffDecision, type SignOffDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { Session } from '../auth/session';
import { leadsSetup } from '../setups/setup-lead';
import { RunsApi } from './runs-api';
import { ShownDatePipe } from '../dates/shown-dates';

/**
 * The shift lead's sign-off of a run: a decision (key kept, key discarded, hardware action needed)
 * and a comment, for a lead of its setup, except under the four-eyes rule the one who uploaded
 * it (told why); the recorded sign-off for everyone.
 */
@Component({
  selector: 'bk-sign-off-panel',
  imports: [ShownDatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, ReactiveFormsModule],
  templateUrl: './sign-off-panel.html',
  styleUrl: './sign-off-panel.scss',
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

  protected readonly decisions = SIGN_OFF_DECISIONS;
  protected readonly decisionWords = SIGN_OFF_DECISION_WORDS;
  protected readonly decision = new FormControl<SignOffDecision | null>(null, Validators.required);
  protected readonly comment = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(4000)] });
  protected readonly saving = signal(false);
  protected readonly failure = signal('');

  protected readonly finished = computed(() => FINISHED_STATES.includes(this.run().state));
  /** Whether the signed-in user leads the run's setup. */
  protected readonly leadsSetup = computed(() => leadsSetup(this.session.user(), this.setup()));
  /** Whether the four-eyes rule keeps the signed-in shift lead from signing off their own upload. */
  protected readonly ownUpload = computed(() => this.leadsSetup() && this.run().fourEyes && this.run().uploadedById === this.session.user()?.id);
  protected readonly otherLeadNames = computed(
    () =>
      this.setup()
        ?.shiftLeads.filter((lead) => lead.id !== this.session.user()?.id)
        .map((lead) => lead.name)
        .join(', ') || 'an admin assigns one to the setup',
  );
  /** A key is kept only from an ACCEPT that extracts one. */
  protected readonly keyCanBeKept = computed(() => this.run().verdict === 'ACCEPT' && (this.run().result?.key?.finiteKeyBits ?? 0) > 0);
  protected readonly noKeyReason = computed(() =>
    this.run().verdict === 'ACCEPT'
      ? 'No key can be kept: the finite key is 0 bits at this size.'
      : `No key can be kept from a run judged ${this.run().verdict ?? 'without a verdict'}.`,
  );
  protected readonly leadNames = computed(
    () =>
      this.setup()
        ?.shiftLeads.map((lead) => lead.name)
        .join(', ') || 'a shift lead',
  );

  protected signOffRun(): void {
    this.comment.setValue(this.comment.value.trim());
    const decision = this.decision.value;
    if (this.comment.invalid || decision === null) {
      this.comment.markAsTouched();
      this.decision.markAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set('');
    this.runsApi.signOff(this.run().id, { decision, comment: this.comment.value }).subscribe({
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
