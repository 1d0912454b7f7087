import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';

import { failureMessage } from '../api/loaded';
import type { PagedList, PageQuery } from './paged-list';

/**
 * What a paged list shows around its table: a bar while it loads, the failure with "Try again",
 * the empty list (no match under the filters, with "Clear filters"; or the content marked
 * `bkListEmpty` when there is nothing at all), and once there are rows the table (the content)
 * or its panels, with the paginator under it.
 */
@Component({
  selector: 'bk-list-frame',
  imports: [MatButtonModule, MatPaginatorModule, MatProgressBarModule],
  template: `
    @switch (list().page().status) {
      @case ('loading') {
        <div class="bk-state" role="status">
          <mat-progress-bar mode="indeterminate" [attr.aria-label]="'Loading ' + what()" />
          <p>Loading {{ what() }}…</p>
        </div>
      }
      @case ('failed') {
        <div class="bk-state" role="alert">
          <p>{{ capitalised() }} could not be loaded. {{ failure() }}</p>
          <button mat-stroked-button type="button" (click)="list().retry()">Try again</button>
        </div>
      }
      @case ('ready') {
        @if (list().total() === 0) {
          <div class="bk-state" [attr.data-testid]="emptyTestId()">
            @if (list().filtered()) {
              <p>{{ noMatch() }}</p>
              <button mat-stroked-button type="button" (click)="list().clear()">Clear filters</button>
            } @else {
              <ng-content select="[bkListEmpty]" />
            }
          </div>
        } @else {
          <div [class.bk-table-frame]="framed()">
            <ng-content />
            <mat-paginator
              [length]="list().total()"
              [pageIndex]="list().query().page"
              [pageSize]="list().query().pageSize"
              [pageSizeOptions]="[10, 25, 50, 100]"
              (page)="list().turnPage($event)"
              [attr.aria-label]="'Pages of ' + what()"
            />
          </div>
        }
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ListFrame {
  readonly list = input.required<PagedList<PageQuery, unknown>>();
  /** What the list holds, as in "Loading the runs…": "the runs", "the trail". */
  readonly what = input.required<string>();
  /** The sentence when no row matches the filters. */
  readonly noMatch = input.required<string>();
  readonly emptyTestId = input<string | null>(null);
  /** Whether the rows are a table, drawn in a frame that scrolls sideways; panels (false) stand on their own. */
  readonly framed = input(true);

  protected readonly capitalised = computed(() => this.what().charAt(0).toUpperCase() + this.what().slice(1));
  protected readonly failure = computed(() => failureMessage(this.list().page()));
}
