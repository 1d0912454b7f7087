import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router } from '@angular/router';

import { apiErrorMessage } from '../api/api-error-message';
import { Session } from '../auth/session';
import { isReturnable } from '../auth/sign-in-url';
import { ProductMark } from '../shell/product-mark';

/** The sign-in page: e-mail and password, then back to the page the user wanted. */
@Component({
  selector: 'bk-sign-in',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, ProductMark, ReactiveFormsModule],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  /** The page to open after signing in, from the `returnUrl` query parameter. */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });

  /** Whether a sign-in request is on its way. */
  protected readonly signingIn = signal(false);

  /** The server's sentence when sign-in failed. */
  protected readonly failure = signal<string | null>(null);

  protected signIn(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.signingIn.set(true);
    this.failure.set(null);
    this.session
      .signIn(this.form.getRawValue())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          const returnUrl = this.returnUrl();
          void this.router.navigateByUrl(isReturnable(returnUrl) ? returnUrl : '/');
        },
        error: (error: unknown) => {
          this.signingIn.set(false);
          this.failure.set(apiErrorMessage(error));
        },
      });
  }
}
