import { Location } from '@angular/common';
import { effect, inject, untracked, type Signal } from '@angular/core';
import type { FormGroup } from '@angular/forms';
import { ActivatedRoute, Router, type ParamMap } from '@angular/router';
import { DateTime } from 'luxon';

/** How a filter is written in the address: a positive id, text, a day (YYYY-MM-DD), or a flag that is only ever `true`. */
export type UrlFilterKind = 'id' | 'text' | 'day' | 'flag';

/** The filter controls a list keeps in the address, by name, each with its kind. */
export type UrlFilters = Record<string, UrlFilterKind>;

/** The paging parameters every list keeps in the address besides its filters. */
const PAGING = ['page', 'pageSize', 'sort', 'direction'] as const;

/** The form value of a filter written `text` in the address, or undefined when it does not read as its kind. */
function fromAddress(kind: UrlFilterKind, text: string): unknown {
  switch (kind) {
    case 'id':
      return /^[1-9]\d{0,9}$/.test(text) ? Number(text) : undefined;
    case 'day': {
      const day = DateTime.fromISO(text);
      return /^\d{4}-\d{2}-\d{2}$/.test(text) && day.isValid ? day : undefined;
    }
    case 'flag':
      return text === 'true' ? true : undefined;
    default:
      return text;
  }
}

/** Sets the filter controls from the address (those it names and can read); call before the list reads the form. */
export function readUrlFilters(form: FormGroup, filters: UrlFilters, params: ParamMap): void {
  for (const [name, kind] of Object.entries(filters)) {
    const text = params.get(name);
    const value = text === null ? undefined : fromAddress(kind, text);
    if (value !== undefined) form.controls[name]?.setValue(value, { emitEvent: false });
  }
}

/** The page, page size and sort written in the address, as numbers and words; what is not there or not readable is left out. */
export function readUrlPaging(params: ParamMap): { page?: number; pageSize?: number; sort?: string; direction?: 'asc' | 'desc' } {
  const page = Number(params.get('page'));
  const pageSize = Number(params.get('pageSize'));
  const direction = params.get('direction');
  return {
    ...(Number.isInteger(page) && page > 0 ? { page } : {}),
    ...([10, 25, 50, 100].includes(pageSize) ? { pageSize } : {}),
    ...(params.get('sort') ? { sort: params.get('sort')! } : {}),
    ...(direction === 'asc' || direction === 'desc' ? { direction } : {}),
  };
}

/**
 * Writes the list's query to the address whenever it changes, replacing the current entry (Back
 * leaves the list rather than stepping through its filters): the filters named, and the page, page
 * size and sort where they differ from the first page. Other parameters (an open tab) stay. It
 * rewrites the address without a router navigation, which would cancel one under way: a filter
 * typed a moment before a row is clicked must not pull the page back to the list.
 * Call in an injection context.
 */
export function writeQueryToUrl(query: Signal<object>, filters: UrlFilters, firstPage: object): void {
  const router = inject(Router);
  const route = inject(ActivatedRoute);
  const location = inject(Location);
  effect(() => {
    const asked = query() as Record<string, unknown>;
    const defaults = firstPage as Record<string, unknown>;
    // A query holds numbers, words and flags only (days are YYYY-MM-DD by then).
    const written = (value: unknown) => (typeof value === 'number' || typeof value === 'boolean' || (typeof value === 'string' && value !== '') ? String(value) : null);
    const queryParams: Record<string, string | null> = {};
    for (const name of Object.keys(filters)) queryParams[name] = written(asked[name]);
    for (const name of PAGING) queryParams[name] = asked[name] === defaults[name] ? null : written(asked[name]);
    untracked(() => {
      // Not once the router is taking the page elsewhere: the list is about to go.
      if (router.currentNavigation() !== null) return;
      location.replaceState(router.serializeUrl(router.createUrlTree([], { relativeTo: route, queryParams, queryParamsHandling: 'merge' })));
    });
  });
}
