import { computed, inject, linkedSignal, signal, type Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { FormGroup } from '@angular/forms';
import type { PageEvent } from '@angular/material/paginator';
import { ActivatedRoute } from '@angular/router';
import { debounceTime, filter, map, type Observable, switchMap } from 'rxjs';

import { loaded, pageContents, type Loaded } from '../api/loaded';
import { readUrlFilters, readUrlPaging, writeQueryToUrl, type UrlFilters } from './url-filters';

/** What every list query of the API holds: the page, its size, and for sortable lists the sort. */
export interface PageQuery {
  page: number;
  pageSize: number;
  sort?: string;
  direction?: 'asc' | 'desc';
}

/** A page of a list as the API answers it. */
export interface ListPage<Item> {
  items: Item[];
  total: number;
}

export interface PagedListOptions<Query extends PageQuery, Item> {
  /** The filter form: each change (once it is valid) asks again, from the first page. */
  filters: FormGroup;
  /** The query's filter fields from the form; empty ones (null, '', undefined) are dropped. */
  chosen: () => Partial<Query>;
  /** The query with no filter chosen: the first page, its size, the default sort. */
  firstPage: Query;
  load: (query: Query) => Observable<ListPage<Item>>;
  /** How long typing may pause before the list is asked for again. */
  typingPauseMilliseconds?: number;
  /**
   * The filters kept in the address with the page and sort, so a reload or a shared link opens
   * the same list: read from it at start, written to it on each change.
   */
  url?: UrlFilters;
}

/**
 * A filtered, paged (and sortable) list: the runs list, the finished runs and the system trail
 * page on the server; setups and profiles, a lab's few, page the whole list with {@link pageOfWhole}.
 */
export interface PagedList<Query extends PageQuery, Item> {
  /** The query last asked for. */
  query: Signal<Query>;
  /** The filter fields last applied (none: the whole list). */
  chosen: Signal<Partial<Query>>;
  page: Signal<Loaded<ListPage<Item>>>;
  rows: Signal<Item[]>;
  total: Signal<number>;
  /** Whether any filter is applied. */
  filtered: Signal<boolean>;
  turnPage(event: PageEvent): void;
  /** Sorts by `sort` (back to the first page); an empty or unknown choice sorts as the first page does. */
  sortBy(sort: string | undefined, direction: 'asc' | 'desc' | ''): void;
  /** Asks for the same page again (after a failure). */
  retry(): void;
  /** Empties every filter field: the whole list again, from the first page. */
  clear(): void;
}

const DEFAULT_TYPING_PAUSE_MILLISECONDS = 300;

/** Fills the filter form from the address and answers the page and sort it names. Call in an injection context. */
function readAddress(filters: FormGroup, url: UrlFilters): Partial<PageQuery> {
  const params = inject(ActivatedRoute).snapshot.queryParamMap;
  readUrlFilters(filters, url, params);
  return readUrlPaging(params);
}

/** The fields that hold a value. */
function withoutEmpty<T extends object>(fields: T): Partial<T> {
  return Object.fromEntries(Object.entries(fields).filter(([, value]) => value !== null && value !== undefined && value !== '')) as Partial<T>;
}

/**
 * The state of a paged list under a filter form. A filter change goes back to the first page and
 * keeps the page size and sort; a form that is not valid (a half-typed hash prefix) keeps the list
 * where it was. Call it in an injection context (a component's field).
 */
export function pagedList<Query extends PageQuery, Item>(options: PagedListOptions<Query, Item>): PagedList<Query, Item> {
  const { filters, firstPage } = options;
  const fromAddress = options.url === undefined ? {} : readAddress(filters, options.url);
  const chosen = toSignal(
    filters.valueChanges.pipe(
      debounceTime(options.typingPauseMilliseconds ?? DEFAULT_TYPING_PAUSE_MILLISECONDS),
      filter(() => filters.valid),
      map(() => withoutEmpty(options.chosen())),
    ),
    { initialValue: withoutEmpty(options.chosen()) },
  );
  const paging = linkedSignal<Partial<Query>, PageQuery>({
    source: chosen,
    // The first computation takes the page and sort of the address; each filter change goes back to the first page.
    computation: (_chosen, previous) => (previous === undefined ? { ...firstPage, ...fromAddress } : { ...previous.value, page: 0 }),
  });
  const attempt = signal(0);
  const query = computed<Query>(() => ({ ...firstPage, ...paging(), ...chosen() }));
  const page = toSignal(toObservable(computed(() => ({ query: query(), attempt: attempt() }))).pipe(switchMap(({ query }) => loaded(options.load(query)))), {
    initialValue: { status: 'loading' },
  });
  const contents = computed(() => pageContents(page()));
  if (options.url !== undefined) writeQueryToUrl(query, options.url, firstPage);
  return {
    query,
    chosen,
    page,
    rows: computed(() => contents().rows),
    total: computed(() => contents().total),
    filtered: computed(() => Object.keys(chosen()).length > 0),
    turnPage: (event) => paging.update((current) => ({ ...current, page: event.pageIndex, pageSize: event.pageSize })),
    sortBy: (sort, direction) =>
      paging.update((current) => ({
        ...current,
        page: 0,
        ...(sort !== undefined && direction !== '' ? { sort, direction } : { sort: firstPage.sort, direction: firstPage.direction }),
      })),
    retry: () => attempt.update((count) => count + 1),
    clear: () => filters.reset(),
  };
}

/** The page `query` asks for of a whole list the API answers at once, keeping the items that `matches`. */
export function pageOfWhole<Item>(items: readonly Item[], query: PageQuery, matches: (item: Item) => boolean): ListPage<Item> {
  const kept = items.filter(matches);
  const start = query.page * query.pageSize;
  return { items: kept.slice(start, start + query.pageSize), total: kept.length };
}

/** Whether any of `texts` holds `search` (either case; an empty search holds everywhere). */
export function textHolds(search: string | undefined, ...texts: (string | null | undefined)[]): boolean {
  const wanted = search?.trim().toLocaleLowerCase() ?? '';
  return wanted === '' || texts.some((text) => text?.toLocaleLowerCase().includes(wanted) === true);
}
