import { ClipboardModule } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';

/** Copies a value to the clipboard and says whether it worked: an icon button, or a worded one with `label`. */
@Component({
  selector: 'bk-copy-button',
  imports: [ClipboardModule, MatButtonModule, MatIconModule],
  template: `@if (label(); as label) {
      <!-- The name starts with the words on the button, so speech input finds it by them. -->
      <button mat-stroked-button type="button" [cdkCopyToClipboard]="text()" (cdkCopyToClipboardCopied)="announce($event)" [attr.aria-label]="label + ': ' + what()">
        <mat-icon>content_copy</mat-icon>{{ label }}
      </button>
    } @else {
      <button mat-icon-button type="button" class="bk-copy-icon" [cdkCopyToClipboard]="text()" (cdkCopyToClipboardCopied)="announce($event)" [attr.aria-label]="'Copy ' + what()" [title]="'Copy ' + what()">
        <mat-icon>content_copy</mat-icon>
      </button>
    }`,
  // The icon button sits beside a value in a table row: small enough not to make the row taller.
  styles: `
    .bk-copy-icon {
      --mat-icon-button-state-layer-size: 28px;
      --mat-icon-button-icon-size: 18px;
      vertical-align: middle;

      mat-icon {
        width: 18px;
        height: 18px;
        font-size: 18px;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CopyButton {
  private readonly snackBar = inject(MatSnackBar);

  /** What goes to the clipboard. */
  readonly text = input.required<string>();
  /** Names the value in the button's accessible name and the announcement, e.g. "the upload token". */
  readonly what = input.required<string>();
  /** Words on the button; without them, an icon button. */
  readonly label = input<string | null>(null);

  protected announce(copied: boolean): void {
    const what = this.what();
    const sentence = copied ? `Copied ${what}.` : `${what[0].toUpperCase()}${what.slice(1)} could not be copied: select its text and copy it by hand.`;
    this.snackBar.open(sentence, 'Close', { duration: 4000 });
  }
}
