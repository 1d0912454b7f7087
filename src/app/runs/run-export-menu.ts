import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSnackBar } from '@angular/material/snack-bar';

import type { ExportFormat } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { EXPORT_FORMAT_LABELS, EXPORT_MENU_ORDER } from './export-formats';
import { RunsApi } from './runs-api';

const ICONS: Record<ExportFormat, string> = {
  json: 'data_object',
  'counts.csv': 'table_chart',
  'blocks.csv': 'table_chart',
  pdf: 'picture_as_pdf',
};

/** The menu that downloads a finished run as its signed JSON report, its CSV tables or a PDF. */
@Component({
  selector: 'bk-run-export-menu',
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    <button mat-stroked-button type="button" [matMenuTriggerFor]="exports" [disabled]="downloading()" data-testid="export-menu">
      <mat-icon>download</mat-icon>{{ downloading() ? 'Preparing…' : 'Export' }}
    </button>
    <mat-menu #exports="matMenu" xPosition="before">
      @for (choice of choices; track choice.format) {
        <button mat-menu-item type="button" (click)="download(choice.format)" [attr.data-testid]="choice.testId">
          <mat-icon>{{ choice.icon }}</mat-icon>
          <span>{{ choice.label }}</span>
        </button>
      }
    </mat-menu>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunExportMenu {
  private readonly runsApi = inject(RunsApi);
  private readonly snackBar = inject(MatSnackBar);

  /** The run to export. */
  readonly runId = input.required<number>();

  protected readonly choices = EXPORT_MENU_ORDER.map((format) => ({
    format,
    label: EXPORT_FORMAT_LABELS[format],
    icon: ICONS[format],
    testId: `export-${format.replace('.', '-')}`,
  }));
  protected readonly downloading = signal(false);

  protected download(format: ExportFormat): void {
    this.downloading.set(true);
    this.runsApi.export(this.runId(), format).subscribe({
      next: () => this.downloading.set(false),
      error: (error: unknown) => {
        this.downloading.set(false);
        this.snackBar.open(`The ${EXPORT_FORMAT_LABELS[format]} could not be downloaded. ${apiErrorMessage(error)}`, 'Close');
      },
    });
  }
}
