import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { of } from 'rxjs';

import { MIN_PASSWORD_LENGTH, type Role, type UpdateUserRequest, type UserDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { RoleField } from './role-field';
import { UsersApi } from './users-api';

/**
 * The admin's form for a person: a new one (name, e-mail, a first password, roles), or one already
 * there (data: the user) whose name, e-mail and roles change. Closes with the user as saved.
 */
@Component({
  selector: 'bk-user-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule, RoleField],
  templateUrl: './user-dialog.html',
  styleUrl: './user-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserDialog {
  private readonly usersApi = inject(UsersApi);
  private readonly dialogRef = inject<MatDialogRef<UserDialog, UserDto>>(MatDialogRef);
  private readonly destroyRef = inject(DestroyRef);

  /** The person being changed; null for a new one. */
  protected readonly user = inject<UserDto | null>(MAT_DIALOG_DATA, { optional: true }) ?? null;
  protected readonly minPasswordLength = MIN_PASSWORD_LENGTH;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.user?.name ?? '', Validators.required],
    email: [this.user?.email ?? '', [Validators.required, Validators.email]],
    // Only a new person gets a first password here.
    password: ['', this.user === null ? [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH)] : []],
    roles: [[...(this.user?.roles ?? [])] as Role[], Validators.required],
  });

  /** Whether the request is on its way. */
  protected readonly saving = signal(false);

  /** The server's sentence when the person could not be saved. */
  protected readonly failure = signal<string | null>(null);

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, email, password, roles } = this.form.getRawValue();
    const user = this.user;
    const saving =
      user === null ? this.usersApi.create({ name: name.trim(), email: email.trim(), password, roles }) : this.changesOf(user, { name: name.trim(), email: email.trim(), roles });
    this.saving.set(true);
    this.failure.set(null);
    saving.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(apiErrorMessage(error));
      },
    });
  }

  /** Sends only the fields that changed; when nothing changed, nothing is sent. */
  private changesOf(user: UserDto, wanted: Required<Pick<UpdateUserRequest, 'name' | 'email' | 'roles'>>) {
    const changes: UpdateUserRequest = {};
    if (wanted.name !== user.name) changes.name = wanted.name;
    if (wanted.email.toLowerCase() !== user.email) changes.email = wanted.email;
    if ([...wanted.roles].sort().join() !== [...user.roles].sort().join()) changes.roles = wanted.roles;
    return Object.keys(changes).length === 0 ? of(user) : this.usersApi.update(user.id, changes);
  }
}
