import { booleanAttribute, ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** A chart's data as a table: the chart's text equivalent. */
export interface ChartTable {
  /** What the table holds, and anything drawn across every row (a threshold, a bound). */
  caption: string;
  /** The column headings; the first column names each row. */
  columns: string[];
  /** The rows, each a cell per column, in words and figures as the page writes them. */
  rows: string[][];
}

/** Tells tables apart on one page. */
let tablesMade = 0;

/**
 * The text equivalent of a chart: a "Show as table" button under it that opens its data as a
 * table, for anyone who cannot or would rather not read the drawing. With `hiddenTable` (a chart
 * the size of a table cell, where a button would crowd the row) there is no button: the table is
 * for screen readers only, and the chart names it by `aria-describedby` with `tableId`.
 */
@Component({
  selector: 'bk-chart-table',
  imports: [MatButtonModule, MatIconModule],
  template: `
    @if (!hiddenTable()) {
      <button mat-button type="button" class="bk-chart-table-toggle" [attr.aria-expanded]="open()" [attr.aria-controls]="tableId" (click)="open.set(!open())">
        <mat-icon>{{ open() ? 'hide_source' : 'table' }}</mat-icon>{{ open() ? 'Hide the table' : 'Show as table' }}
      </button>
    }
    <!-- Shown, the frame scrolls sideways on a phone: it takes the keyboard's focus so the keys can scroll it. -->
    <div
      [id]="tableId"
      [hidden]="!hiddenTable() && !open()"
      [class]="hiddenTable() ? 'bk-visually-hidden' : 'bk-chart-table-frame'"
      [attr.tabindex]="hiddenTable() ? null : 0"
      [attr.role]="hiddenTable() ? null : 'region'"
      [attr.aria-labelledby]="hiddenTable() ? null : tableId + '-caption'"
    >
      <table class="bk-figure-table">
        <caption [id]="tableId + '-caption'">{{ table().caption }}</caption>
        <thead>
          <tr>
            @for (column of table().columns; track $index) {
              <th scope="col">{{ column }}</th>
            }
          </tr>
        </thead>
        <tbody>
          @for (row of table().rows; track $index) {
            <tr>
              @for (cell of row; track $index) {
                @if ($first) {
                  <th scope="row">{{ cell }}</th>
                } @else {
                  <td>{{ cell }}</td>
                }
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styles: `
    :host { display: block; }
    .bk-chart-table-toggle { margin-top: 4px; }
    .bk-chart-table-frame { margin-top: 4px; overflow-x: auto; container-type: inline-size; }
    td { white-space: nowrap; }
    /* A table wider than its frame scrolls; its caption stays in view, as wide as the frame. */
    caption { position: sticky; left: 0; box-sizing: border-box; max-inline-size: 100cqi; padding: 4px 8px; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); text-align: start; }
    th[scope='row'] { font-weight: 500; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartTableView {
  /** The chart's data. */
  readonly table = input.required<ChartTable>();
  /** Whether the table is for screen readers only, with no button (a chart inside a table row). */
  readonly hiddenTable = input(false, { transform: booleanAttribute });

  /** The table's id, for the chart's `aria-describedby` and the button's `aria-controls`. */
  readonly tableId = `bk-chart-table-${++tablesMade}`;

  /** Whether the table is shown. */
  protected readonly open = signal(false);
}
