import { ChangeDetectionStrategy, Component, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/**
 * Where a log file is given: dropped on the dashed area or chosen with its button (plain CSV or
 * gzip). Emits the file; reading it is the page's.
 */
@Component({
  selector: 'bk-log-drop',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div
      class="bk-drop"
      [class.bk-drop-active]="dragging()"
      (dragover)="$event.preventDefault(); dragging.set(true)"
      (dragleave)="dragging.set(false)"
      (drop)="dropLog($event)"
      [attr.data-testid]="testId() + '-drop'"
    >
      <mat-icon aria-hidden="true">upload_file</mat-icon>
      <span>{{ prompt() }}</span>
      <button mat-stroked-button type="button" (click)="picker.click()">{{ chooseLabel() }}</button>
      <input
        #picker
        type="file"
        class="bk-visually-hidden"
        accept=".csv,.gz,.txt,text/csv,application/gzip"
        [attr.aria-label]="fileLabel()"
        [attr.data-testid]="testId() + '-input'"
        (change)="pickLog(picker)"
      />
    </div>
  `,
  styles: `
    .bk-drop {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 12px;
      padding: 24px;
      border: 2px dashed var(--mat-sys-outline);
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-surface-container-lowest);

      mat-icon {
        color: var(--mat-sys-primary);
      }
    }

    .bk-drop-active {
      border-color: var(--mat-sys-primary);
      background: var(--mat-sys-primary-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LogDrop {
  /** The words before the button, e.g. "Drop the round log here, or". */
  readonly prompt = input.required<string>();
  /** The button's words. */
  readonly chooseLabel = input('Choose a file');
  /** The file field's accessible name. */
  readonly fileLabel = input.required<string>();
  /** Names the area (`<testId>-drop`) and the file field (`<testId>-input`) for tests. */
  readonly testId = input.required<string>();
  /** The file dropped or chosen. */
  readonly picked = output<File>();

  protected readonly dragging = signal(false);

  protected dropLog(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files.item(0);
    if (file) this.picked.emit(file);
  }

  protected pickLog(input: HTMLInputElement): void {
    const file = input.files?.item(0);
    if (file) this.picked.emit(file);
    // The same file chosen again (after fixing it on disk) must be read again.
    input.value = '';
  }
}
