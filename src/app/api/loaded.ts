import { catchError, map, Observable, of, startWith } from 'rxjs';

import { apiErrorMessage } from './api-error-message';

/** Something fetched: still loading, there, or failed with a sentence. */
export type Loaded<T> = { status: 'loading' } | { status: 'ready'; value: T } | { status: 'failed'; message: string };

/** Wraps a request's values and its failure into {@link Loaded} states, starting with `loading`. */
export function loaded<T>(source: Observable<T>): Observable<Loaded<T>> {
  return source.pipe(
    map((value): Loaded<T> => ({ status: 'ready', value })),
    catchError((error: unknown) => of<Loaded<T>>({ status: 'failed', message: apiErrorMessage(error) })),
    startWith<Loaded<T>>({ status: 'loading' }),
  );
}

/** The rows and total of a loaded page of a list, empty while loading or after a failure. */
export function pageContents<T>(page: Loaded<{ items: T[]; total: number }>): { rows: T[]; total: number } {
  return page.status === 'ready' ? { rows: page.value.items, total: page.value.total } : { rows: [], total: 0 };
}

/** The value once it is there; null while loading or after a failure. */
export function readyValue<T>(state: Loaded<T>): T | null {
  return state.status === 'ready' ? state.value : null;
}

/** The failure's sentence; empty while loading or once the value is there. */
export function failureMessage(state: Loaded<unknown>): string {
  return state.status === 'failed' ? state.message : '';
}
