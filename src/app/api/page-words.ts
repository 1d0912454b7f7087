import { Injectable } from '@angular/core';
import { MatPaginatorIntl } from '@angular/material/paginator';

import { formatCount } from '@shared/format/numbers';

/** The paginator of every list in Bellkeep's words rather than the library's. */
@Injectable()
export class PageWords extends MatPaginatorIntl {
  override itemsPerPageLabel = 'Rows on a page';
  override nextPageLabel = 'Later rows';
  override previousPageLabel = 'Earlier rows';
  override firstPageLabel = 'First rows';
  override lastPageLabel = 'Last rows';

  /** "Rows 26 to 50 of 1 204", "No rows". */
  override getRangeLabel = (page: number, pageSize: number, length: number): string => {
    if (length === 0 || pageSize === 0) return 'No rows';
    const first = page * pageSize + 1;
    const last = Math.min(length, (page + 1) * pageSize);
    return first > length ? `Past the last of ${formatCount(length)} rows` : `Rows ${formatCount(first)} to ${formatCount(last)} of ${formatCount(length)}`;
  };
}
