import { afterEveryRender, Directive, ElementRef, inject } from '@angular/core';

/**
 * A list's table that shows as cards on a phone (the look is `card-tables` in lists/_cards.scss):
 * after each render it labels every body cell with its column's heading (`data-label`), which the
 * card draws above the value. An empty cell, and a column whose heading is meant only for screen
 * readers (`.bk-visually-hidden`, as over a column of row actions), get no label.
 */
@Directive({
  selector: 'table[bkCardTable]',
  host: { class: 'bk-card-table' },
})
export class CardTable {
  private readonly table = inject<ElementRef<HTMLTableElement>>(ElementRef).nativeElement;

  constructor() {
    afterEveryRender({ write: () => labelCells(this.table) });
  }
}

/** Writes each body cell's column heading (none for an empty cell) into its `data-label`, touching only cells whose label changed. */
export function labelCells(table: HTMLTableElement): void {
  const headings = Array.from(table.tHead?.rows[0]?.cells ?? [], visibleHeading);
  for (const body of Array.from(table.tBodies)) {
    for (const row of Array.from(body.rows)) {
      Array.from(row.cells).forEach((cell, column) => {
        const label = cell.textContent.trim() === '' ? '' : (headings[column] ?? '');
        if (cell.dataset['label'] !== label) cell.dataset['label'] = label;
      });
    }
  }
}

function visibleHeading(heading: HTMLTableCellElement): string {
  return heading.querySelector('.bk-visually-hidden') === null ? heading.textContent.trim() : '';
}
