import { afterEveryRender, Directive, ElementRef, inject } from '@angular/core';

/**
 * A table that shows as cards on a phone (the look is `card-tables` in lists/_cards.scss): a list's
 * mat-table or a plain table of figures. After each render it labels every body and footer cell
 * with its column's heading (`data-label`), which the card draws above the value. An empty cell, a
 * cell spanning several columns (words that say what they are), and a column whose heading is
 * meant only for screen readers (`.bk-visually-hidden`, as over a column of row actions), get no label.
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

/** Writes each body and footer cell's column heading (none for an empty or spanning cell) into its `data-label`, touching only cells whose label changed. */
export function labelCells(table: HTMLTableElement): void {
  const headings = Array.from(table.tHead?.rows[0]?.cells ?? [], visibleHeading);
  const sections = [...Array.from(table.tBodies), ...(table.tFoot ? [table.tFoot] : [])];
  for (const section of sections) {
    for (const row of Array.from(section.rows)) {
      let column = 0;
      for (const cell of Array.from(row.cells)) {
        const label = cell.textContent.trim() === '' || cell.colSpan > 1 ? '' : (headings[column] ?? '');
        if (cell.dataset['label'] !== label) cell.dataset['label'] = label;
        column += cell.colSpan;
      }
    }
  }
}

function visibleHeading(heading: HTMLTableCellElement): string {
  return heading.querySelector('.bk-visually-hidden') === null ? heading.textContent.trim() : '';
}
