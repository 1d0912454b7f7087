import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';

import { STATIONS, type CreatedUploadTokenDto, type SetupDto, type StationName } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { CopyButton } from '../clipboard/copy-button';
import { SetupsApi } from './setups-api';
import { ShownDatePipe } from '../dates/shown-dates';

/** The longest validity the server takes, in days. */
const LONGEST_VALIDITY_DAYS = 366;

/** What the computer holding a token uploads: joined logs, or one station's own log. */
export type TokenUploads = 'joined' | StationName;

/**
 * Makes an upload token for a setup's acquisition computer (one that joins both stations' records,
 * or one station's own computer), then shows it this once with a copy button: the server keeps only
 * its hash. Closes with the token's listing once it is made.
 */
@Component({
  selector: 'bk-new-upload-token-dialog',
  imports: [CopyButton, ShownDatePipe, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, ReactiveFormsModule],
  templateUrl: './new-upload-token-dialog.html',
  styleUrl: './new-upload-token-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewUploadTokenDialog {
  private readonly setupsApi = inject(SetupsApi);
  private readonly dialogRef = inject<MatDialogRef<NewUploadTokenDialog, CreatedUploadTokenDto>>(MatDialogRef);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly setup = inject<SetupDto>(MAT_DIALOG_DATA);
  protected readonly longestValidity = LONGEST_VALIDITY_DAYS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(120)]],
    validDays: [90, [Validators.required, Validators.min(1), Validators.max(LONGEST_VALIDITY_DAYS)]],
    uploads: new FormControl<TokenUploads>('joined', { nonNullable: true }),
  });
  /** The choices of what the computer uploads, with the setup's names for the stations. */
  protected readonly uploadChoices: { value: TokenUploads; words: string }[] = [
    { value: 'joined', words: 'Joined logs' },
    ...STATIONS.map((station) => ({ value: station, words: `Station ${station}’s computer (${station === 'A' ? this.setup.stationALabel : this.setup.stationBLabel})` })),
  ];
  protected readonly saving = signal(false);
  protected readonly failure = signal('');
  /** The token once made: shown here and nowhere else, ever. */
  protected readonly created = signal<CreatedUploadTokenDto | null>(null);

  protected createToken(): void {
    if (this.form.invalid || this.saving()) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, validDays, uploads } = this.form.getRawValue();
    this.saving.set(true);
    this.failure.set('');
    this.setupsApi
      .createUploadToken(this.setup.id, { name: name.trim(), validDays, ...(uploads === 'joined' ? {} : { station: uploads }) })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (created) => {
          this.saving.set(false);
          this.created.set(created);
          // Neither Escape nor a click outside closes it now: the token is gone once the dialog is.
          this.dialogRef.disableClose = true;
        },
        error: (error: unknown) => {
          this.saving.set(false);
          this.failure.set(apiErrorMessage(error));
        },
      });
  }

  protected finish(): void {
    this.dialogRef.close(this.created() ?? undefined);
  }
}
