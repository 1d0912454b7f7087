import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

/** What a {@link ConfirmDialog} asks. */
export interface ConfirmQuestion {
  /** Short heading, e.g. "Deactivate Ada Marsh?". */
  readonly title: string;
  /** What will happen, in a sentence or two. */
  readonly message: string;
  /** Words on the button that goes ahead, e.g. "Deactivate". */
  readonly confirmLabel: string;
}

/** Asks before a consequential step; closes with `true` when the user goes ahead. */
@Component({
  selector: 'bk-confirm-dialog',
  imports: [MatButtonModule, MatDialogModule],
  template: `
    <h2 mat-dialog-title>{{ question.title }}</h2>
    <mat-dialog-content>
      <p>{{ question.message }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" cdkFocusInitial>Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">
        {{ question.confirmLabel }}
      </button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly question = inject<ConfirmQuestion>(MAT_DIALOG_DATA);
}
