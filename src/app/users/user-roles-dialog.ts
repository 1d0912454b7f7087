import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';

import type { Role, UserDto } from '../../../shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { RoleField } from './role-field';
import { UsersApi } from './users-api';

/** The admin's form for changing one user's roles; closes with the updated user. */
@Component({
  selector: 'bk-user-roles-dialog',
  imports: [MatButtonModule, MatDialogModule, ReactiveFormsModule, RoleField],
  templateUrl: './user-roles-dialog.html',
  styleUrl: './user-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserRolesDialog {
  private readonly usersApi = inject(UsersApi);
  private readonly dialogRef = inject<MatDialogRef<UserRolesDialog, UserDto>>(MatDialogRef);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly user = inject<UserDto>(MAT_DIALOG_DATA);
  protected readonly form = new FormGroup({
    roles: new FormControl<Role[]>([...this.user.roles], {
      nonNullable: true,
      validators: Validators.required,
    }),
  });

  /** Whether the request is on its way. */
  protected readonly saving = signal(false);

  /** The server's sentence when the roles could not be changed. */
  protected readonly failure = signal<string | null>(null);

  protected saveRoles(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.usersApi
      .update(this.user.id, this.form.getRawValue())
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
