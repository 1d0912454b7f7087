import { HttpParams } from '@angular/common/http';

/** A query object as URL parameters; unset fields (null, undefined, empty text) are left out. */
export function queryParams(query: object): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== null && value !== undefined && value !== '') params = params.set(key, String(value));
  }
  return params;
}
