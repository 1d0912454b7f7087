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
