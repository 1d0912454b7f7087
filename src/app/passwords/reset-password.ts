import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { ActivatedRoute, RouterLink } from '@angular/router';

import { apiErrorMessage } from '../api/api-error-message';
import { NEW_PASSWORD_VALIDATORS, NewPasswordFields } from './new-password-fields';
import { ProductMark } from '../shell/product-mark';
import { PasswordsApi } from './passwords-api';

/** The secret of a reset link: the part after `#` (a fragment never reaches a server's logs). */
const SECRET = /^[0-9a-f]{64}$/;

/** The page a mailed reset link opens: choose a new password, then sign in with it. */
@Component({
  selector: 'bk-reset-password',
  imports: [MatButtonModule, NewPasswordFields, ProductMark, ReactiveFormsModule, RouterLink],
  templateUrl: './reset-password.html',
  styleUrl: '../sign-in/sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPassword {
  private readonly passwordsApi = inject(PasswordsApi);

  protected readonly secret = inject(ActivatedRoute).snapshot.fragment ?? '';
  protected readonly secretLooksRight = SECRET.test(this.secret);
  protected readonly form = inject(NonNullableFormBuilder).group({
    newPassword: ['', NEW_PASSWORD_VALIDATORS],
    repeated: ['', Validators.required],
  });
  protected readonly saving = signal(false);
  protected readonly done = signal(false);
  protected readonly failure = signal('');

  protected save(): void {
    const { newPassword, repeated } = this.form.getRawValue();
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    if (repeated !== newPassword) {
      this.failure.set('The two passwords differ.');
      return;
    }
    this.saving.set(true);
    this.failure.set('');
    this.passwordsApi.reset({ secret: this.secret, newPassword }).subscribe({
      next: () => this.done.set(true),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(apiErrorMessage(error));
      },
    });
  }
}
