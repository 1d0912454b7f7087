import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { map, type Observable } from 'rxjs';

import { FilterBar } from './filter-bar';
import { pagedList, pageOfWhole, textHolds, type PagedList, type PageQuery } from './paged-list';

/** The query of a list searched by its words: the page and the words typed. */
export interface WordQuery extends PageQuery {
  search: string;
}

/**
 * A whole list the API answers at once (a lab's setups or profiles), paged in the browser and
 * narrowed to the items whose `words` hold what is typed (in either case). Call in an injection context.
 */
export function searchedList<Item>(
  load: () => Observable<Item[]>,
  words: (item: Item) => (string | null | undefined)[],
): PagedList<WordQuery, Item> & { search: FormControl<string | null> } {
  const search = new FormControl('');
  const list = pagedList<WordQuery, Item>({
    filters: new FormGroup({ search }),
    chosen: () => ({ search: search.value ?? '' }),
    firstPage: { page: 0, pageSize: 10, search: '' },
    load: (query) => load().pipe(map((items) => pageOfWhole(items, query, (item) => textHolds(query.search, ...words(item))))),
  });
  return { ...list, search };
}

/** The search field above a list made by `searchedList`, with "Clear filters" once something is typed. */
@Component({
  selector: 'bk-word-search',
  imports: [FilterBar, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <form [attr.aria-label]="label()" (submit)="$event.preventDefault()">
      <bk-filter-bar [list]="list()">
        <mat-form-field appearance="outline" subscriptSizing="dynamic" class="bk-filter-wide">
          <mat-label>Find</mat-label>
          <input matInput [formControl]="list().search" autocomplete="off" [placeholder]="placeholder()" />
        </mat-form-field>
      </bk-filter-bar>
    </form>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WordSearch {
  readonly list = input.required<ReturnType<typeof searchedList<unknown>>>();
  /** The form's name for screen readers: "Find a setup". */
  readonly label = input.required<string>();
  /** What the words are searched in: "Name, station, shift lead". */
  readonly placeholder = input.required<string>();
}
