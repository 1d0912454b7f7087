import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { MatSnackBar } from '@angular/material/snack-bar';
import { filter, switchMap } from 'rxjs';

import type { CreatedUploadTokenDto, SetupDto, UploadTokenDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { ConfirmDialog, type ConfirmQuestion } from '../confirm/confirm-dialog';
import { CardTable } from '../lists/card-table';
import { NewUploadTokenDialog } from './new-upload-token-dialog';
import { SetupsApi } from './setups-api';
import { uploadTokenState } from './upload-token-state';
import { ShownDatePipe } from '../dates/shown-dates';

/** A setup's upload tokens for its acquisition computers: when each was last used, when it expires; new ones and revoking. */
@Component({
  selector: 'bk-upload-tokens',
  imports: [CardTable, ShownDatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  templateUrl: './upload-tokens.html',
  styleUrl: './upload-tokens.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadTokens {
  private readonly setupsApi = inject(SetupsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  /** The setup whose tokens these are; only its admins and shift leads see this panel. */
  readonly setup = input.required<SetupDto>();

  protected readonly columns = ['name', 'uploads', 'state', 'lastUsed', 'expires', 'actions'];
  private readonly reload = signal(0);
  protected readonly tokens = toSignal(
    toObservable(computed(() => ({ setupId: this.setup().id, attempt: this.reload() }))).pipe(switchMap(({ setupId }) => loaded(this.setupsApi.uploadTokens(setupId)))),
    { initialValue: { status: 'loading' } },
  );
  /** Each token with its state now. */
  protected readonly rows = computed(() => {
    const tokens = this.tokens();
    const now = new Date();
    return tokens.status === 'ready' ? tokens.value.map((token) => ({ token, state: uploadTokenState(token, now) })) : [];
  });

  /** What the token uploads: "Joined logs", or "Station A’s log (North Hall)". */
  protected uploadsWords(token: UploadTokenDto): string {
    if (token.station === null) return 'Joined logs';
    const setup = this.setup();
    return `Station ${token.station}’s log (${token.station === 'A' ? setup.stationALabel : setup.stationBLabel})`;
  }

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }

  protected openNewToken(): void {
    this.dialog
      .open<NewUploadTokenDialog, SetupDto, CreatedUploadTokenDto>(NewUploadTokenDialog, { data: this.setup(), maxWidth: '96vw' })
      .afterClosed()
      .pipe(filter((created) => created !== undefined))
      .subscribe(() => this.retry());
  }

  protected revokeToken(token: UploadTokenDto): void {
    const question: ConfirmQuestion = {
      title: `Revoke “${token.name}”?`,
      message: `It stops working at once: uploads from the computer that holds it are refused, also those under way. Runs it uploaded stay as they are.`,
      confirmLabel: 'Revoke',
    };
    this.dialog
      .open<ConfirmDialog, ConfirmQuestion, boolean>(ConfirmDialog, { data: question })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.setupsApi.revokeUploadToken(this.setup().id, token.id)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (revoked) => {
          this.retry();
          this.snackBar.open(`“${revoked.name}” is revoked.`, undefined, { duration: 4000 });
        },
        error: (error: unknown) => this.snackBar.open(apiErrorMessage(error), 'Dismiss'),
      });
  }
}
