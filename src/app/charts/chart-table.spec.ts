import { TestBed } from '@angular/core/testing';

import { type ChartTable, ChartTableView } from './chart-table';

/** Two correlators of an invented night, as the correlator chart words them. */
const TABLE: ChartTable = {
  caption: 'The correlators, whose sum is S.',
  columns: ['Correlator', 'Observed', 'Ideal'],
  rows: [
    ['E00', '0.7012', '0.7071'],
    ['E01', '0.6987', '0.7071'],
  ],
};

function shown(hiddenTable: boolean): { host: HTMLElement; settled: () => Promise<unknown> } {
  const fixture = TestBed.createComponent(ChartTableView);
  fixture.componentRef.setInput('table', TABLE);
  fixture.componentRef.setInput('hiddenTable', hiddenTable);
  fixture.detectChanges();
  return { host: fixture.nativeElement as HTMLElement, settled: () => fixture.whenStable() };
}

/** The table's cells row by row, headings included. */
const cells = (host: HTMLElement) => Array.from(host.querySelectorAll('tr'), (row) => Array.from(row.cells, (cell) => cell.textContent.trim()));

describe('ChartTableView', () => {
  it('keeps the table closed under a "Show as table" button, and opens and closes it', async () => {
    const { host, settled } = shown(false);
    const button = host.querySelector('button')!;
    const frame = host.querySelector<HTMLElement>(`#${button.getAttribute('aria-controls')}`)!;
    expect(button.textContent).toContain('Show as table');
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(frame.hidden).toBe(true);

    button.click();
    await settled();
    expect(button.textContent).toContain('Hide the table');
    expect(button.getAttribute('aria-expanded')).toBe('true');
    expect(frame.hidden).toBe(false);
    expect(frame.querySelector('caption')!.textContent).toBe('The correlators, whose sum is S.');
    expect(cells(frame)).toEqual([
      ['Correlator', 'Observed', 'Ideal'],
      ['E00', '0.7012', '0.7071'],
      ['E01', '0.6987', '0.7071'],
    ]);
    // Each row is named by its first cell; the columns by their headings.
    expect(Array.from(frame.querySelectorAll('tbody th'), (th) => [th.getAttribute('scope'), th.textContent])).toEqual([
      ['row', 'E00'],
      ['row', 'E01'],
    ]);
    expect(frame.querySelectorAll('thead th[scope="col"]')).toHaveLength(3);

    button.click();
    await settled();
    expect(frame.hidden).toBe(true);
    expect(button.getAttribute('aria-expanded')).toBe('false');
  });

  it('gives a chart inside a row its table for screen readers only, with no button, each table with an id of its own', () => {
    const first = shown(true).host;
    const second = shown(true).host;
    expect(first.querySelector('button')).toBeNull();
    const frame = first.querySelector<HTMLElement>('.bk-visually-hidden')!;
    expect(frame.hidden).toBe(false);
    expect(cells(frame)[1]).toEqual(['E00', '0.7012', '0.7071']);
    expect(frame.id).toMatch(/^bk-chart-table-\d+$/);
    expect(second.querySelector('.bk-visually-hidden')!.id).not.toBe(frame.id);
  });
});
