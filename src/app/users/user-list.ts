import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { filter, switchMap } from 'rxjs';

import { ROLE_LABELS, type Role, type UserDto, RESET_LINK_HOURS } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { Session } from '../auth/session';
import { ConfirmDialog, type ConfirmQuestion } from '../confirm/confirm-dialog';
import { CardTable } from '../lists/card-table';
import { EmailAddress } from './email-address';
import { UserDialog } from './user-dialog';
import { UsersApi } from './users-api';
import { ShownDatePipe } from '../dates/shown-dates';

/** How far the list has got. */
type LoadState = 'loading' | 'ready' | 'failed';

/** The admin's list of users: add people, change their roles, deactivate and reactivate them. */
@Component({
  selector: 'bk-user-list',
  imports: [
    CardTable,
    ShownDatePipe,
    EmailAddress,
    MatButtonModule,
    MatChipsModule,
    MatIconModule,
    MatMenuModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSortModule,
    MatTableModule,
  ],
  templateUrl: './user-list.html',
  styleUrl: './user-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserList {
  private readonly usersApi = inject(UsersApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);
  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);

  protected readonly columns = ['name', 'email', 'roles', 'active', 'createdAt', 'actions'];
  protected readonly currentUserId = inject(Session).user()?.id;
  protected readonly users = signal<UserDto[]>([]);
  protected readonly loadState = signal<LoadState>('loading');
  protected readonly loadFailure = signal('');
  protected readonly dataSource = new MatTableDataSource<UserDto>([]);

  constructor() {
    this.dataSource.sortingDataAccessor = (user, column) => (column === 'roles' ? user.roles.join(',') : String(user[column as keyof UserDto]));
    // The table's data source is not a signal: keep it in step with the list, sort and paginator.
    effect(() => {
      this.dataSource.data = this.users();
      this.dataSource.sort = this.sort() ?? null;
      this.dataSource.paginator = this.paginator() ?? null;
    });
    this.loadUsers();
  }

  protected loadUsers(): void {
    this.loadState.set('loading');
    this.usersApi
      .list()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (users) => {
          this.users.set(users);
          this.loadState.set('ready');
        },
        error: (error: unknown) => {
          this.loadFailure.set(apiErrorMessage(error));
          this.loadState.set('failed');
        },
      });
  }

  protected openNewUser(): void {
    this.dialog
      .open<UserDialog, null, UserDto>(UserDialog, { data: null })
      .afterClosed()
      .pipe(filter((user) => user !== undefined))
      .subscribe((user) => {
        this.users.update((users) => [...users, user]);
        this.snackBar.open(`${user.name} can now sign in.`, undefined, { duration: 4000 });
      });
  }

  protected openChange(user: UserDto): void {
    this.dialog
      .open<UserDialog, UserDto, UserDto>(UserDialog, { data: user })
      .afterClosed()
      .pipe(filter((updated) => updated !== undefined))
      .subscribe((updated) => {
        this.replaceUser(updated);
        this.snackBar.open(`${updated.name}: changes saved.`, undefined, { duration: 4000 });
      });
  }

  protected confirmActiveChange(user: UserDto): void {
    const active = !user.active;
    const question: ConfirmQuestion = active
      ? {
          title: `Reactivate ${user.name}?`,
          message: `${user.name} will be able to sign in again with their roles as they were.`,
          confirmLabel: 'Reactivate',
        }
      : {
          title: `Deactivate ${user.name}?`,
          message: `${user.name} will be signed out at once and cannot sign in until reactivated. Their work stays in Bellkeep.`,
          confirmLabel: 'Deactivate',
        };
    this.dialog
      .open<ConfirmDialog, ConfirmQuestion, boolean>(ConfirmDialog, { data: question })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.usersApi.update(user.id, { active })),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (updated) => {
          this.replaceUser(updated);
          const outcome = updated.active ? 'is active again' : 'is deactivated';
          this.snackBar.open(`${updated.name} ${outcome}.`, undefined, { duration: 4000 });
        },
        error: (error: unknown) => this.snackBar.open(apiErrorMessage(error), 'Dismiss'),
      });
  }

  protected confirmResetLink(user: UserDto): void {
    const question: ConfirmQuestion = {
      title: `Mail ${user.name} a password link?`,
      message: `${user.email} gets a link to set a new password, usable once within ${RESET_LINK_HOURS} hours. Their current password stays until the link is used; using it signs them out everywhere.`,
      confirmLabel: 'Mail the link',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmQuestion, boolean>(ConfirmDialog, { data: question })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.usersApi.mailResetLink(user.id)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (sent) => this.snackBar.open(`Link mailed to ${sent.sentTo}.`, undefined, { duration: 5000 }),
        error: (error: unknown) => this.snackBar.open(apiErrorMessage(error), 'Dismiss'),
      });
  }

  protected roleLabel(role: Role): string {
    return ROLE_LABELS[role];
  }

  private replaceUser(updated: UserDto): void {
    this.users.update((users) => users.map((user) => (user.id === updated.id ? updated : user)));
  }
}
