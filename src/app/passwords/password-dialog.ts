import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { apiErrorMessage } from '../api/api-error-message';
import { NEW_PASSWORD_VALIDATORS, NewPasswordFields } from './new-password-fields';
import { Session } from '../auth/session';

/** The signed-in person changes their own password: the current one, then the new one twice. Closes with true once changed. */
@Component({
  selector: 'bk-password-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, NewPasswordFields, ReactiveFormsModule],
  templateUrl: './password-dialog.html',
  styleUrl: './password-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasswordDialog {
  private readonly session = inject(Session);
  private readonly dialogRef = inject<MatDialogRef<PasswordDialog, true>>(MatDialogRef);

  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', Validators.required],
    newPassword: ['', NEW_PASSWORD_VALIDATORS],
    repeated: ['', Validators.required],
  });
  protected readonly saving = signal(false);
  protected readonly failure = signal('');
  protected readonly mismatch = signal(false);

  protected save(): void {
    const { currentPassword, newPassword, repeated } = this.form.getRawValue();
    this.mismatch.set(repeated !== '' && repeated !== newPassword);
    if (this.form.invalid || this.mismatch()) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set('');
    this.session.changePassword({ currentPassword, newPassword }).subscribe({
      next: () => this.dialogRef.close(true),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(apiErrorMessage(error));
      },
    });
  }
}
