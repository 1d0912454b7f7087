import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { MIN_PASSWORD_LENGTH, type Role, type UserDto } from '../../../shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { RoleField } from './role-field';
import { UsersApi } from './users-api';

/** The admin's form for adding a user; closes with the created user. */
@Component({
  selector: 'bk-new-user-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule, RoleField],
  templateUrl: './new-user-dialog.html',
  styleUrl: './user-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewUserDialog {
  private readonly usersApi = inject(UsersApi);
  private readonly dialogRef = inject<MatDialogRef<NewUserDialog, UserDto>>(MatDialogRef);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly minPasswordLength = MIN_PASSWORD_LENGTH;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', Validators.required],
    email: ['', [Validators.required, Validators.email]],
    password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH)]],
    roles: [[] as Role[], Validators.required],
  });

  /** Whether the request is on its way. */
  protected readonly saving = signal(false);

  /** The server's sentence when the user could not be added. */
  protected readonly failure = signal<string | null>(null);

  protected createUser(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, email, password, roles } = this.form.getRawValue();
    this.saving.set(true);
    this.failure.set(null);
    this.usersApi
      .create({ name: name.trim(), email: email.trim(), password, roles })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (user) => this.dialogRef.close(user),
        error: (error: unknown) => {
          this.saving.set(false);
          this.failure.set(apiErrorMessage(error));
        },
      });
  }
}
