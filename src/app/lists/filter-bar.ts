import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { PagedList, PageQuery } from './paged-list';

/**
 * The row of filter fields above a list, placed inside the list's filter form (`<form [formGroup]>
 * <bk-filter-bar [list]>…`, so the fields still bind to the form), with "Clear filters" once any is
 * applied, then what is marked `bkFilterEnd` (a command on the whole list, at the far end). Its
 * look is `.bk-filter-bar` in styles.scss: the fields are the list's content, not this view's.
 */
@Component({
  selector: 'bk-filter-bar',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <ng-content />
    @if (list().filtered()) {
      <button mat-button type="button" (click)="list().clear()"><mat-icon>filter_alt_off</mat-icon>Clear filters</button>
    }
    <ng-content select="[bkFilterEnd]" />
  `,
  host: { class: 'bk-filter-bar' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FilterBar {
  /** The list the fields filter. */
  readonly list = input.required<PagedList<PageQuery, unknown>>();
}
