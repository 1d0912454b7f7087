import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import { CardTable } from './card-table';

/** A list of the invented lab's people, its last column of row actions headed for screen readers only. */
@Component({
  imports: [CardTable],
  template: `
    <table bkCardTable>
      <thead>
        <tr>
          <th>Name</th>
          <th>E-mail</th>
          <th><span class="bk-visually-hidden">Actions</span></th>
        </tr>
      </thead>
      <tbody>
        @for (name of names(); track name) {
          <tr>
            <td>{{ name }}</td>
            <td>{{ name === 'Lucia Brandt' ? '' : name.toLowerCase().replace(' ', '.') + '&#64;kestrelfen.example' }}</td>
            <td><button type="button">More</button></td>
          </tr>
        }
      </tbody>
    </table>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class PeopleList {
  readonly names = signal(['Ada Reyes']);
}

describe('CardTable', () => {
  it('labels every cell with its column heading, rows added later too; an empty cell and a heading for screen readers only give no label', async () => {
    const fixture = TestBed.createComponent(PeopleList);
    await fixture.whenStable();
    const host = fixture.nativeElement as HTMLElement;
    const labels = () => Array.from(host.querySelectorAll('tbody tr'), (row) => Array.from(row.querySelectorAll('td'), (cell) => cell.dataset['label']));

    expect(host.querySelector('table')!.classList).toContain('bk-card-table');
    expect(labels()).toEqual([['Name', 'E-mail', '']]);

    fixture.componentInstance.names.set(['Ada Reyes', 'Lucia Brandt']);
    await fixture.whenStable();
    expect(labels()).toEqual([
      ['Name', 'E-mail', ''],
      ['Name', '', ''],
    ]);
  });
});

/** A plain table of figures: a row heading in each row, a footer row with a cell spanning two columns. */
@Component({
  imports: [CardTable],
  template: `
    <table bkCardTable>
      <thead>
        <tr>
          <th>Pair</th>
          <th>Rounds</th>
          <th>Wins</th>
          <th>Win fraction</th>
        </tr>
      </thead>
      <tbody>
        <tr>
          <th scope="row">(0, 0)</th>
          <td>4 008</td>
          <td>1 653</td>
          <td>0.8353</td>
        </tr>
      </tbody>
      <tfoot>
        <tr>
          <th scope="row">Balanced</th>
          <td colspan="2">pairs weighed equally</td>
          <td>0.8385</td>
        </tr>
      </tfoot>
    </table>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class FigureTable {}

describe('CardTable on a plain table of figures', () => {
  it('labels row headings and footer cells too, counting a spanning cell’s columns and giving it no label', async () => {
    const fixture = TestBed.createComponent(FigureTable);
    await fixture.whenStable();
    const host = fixture.nativeElement as HTMLElement;
    const labels = (section: string) => Array.from(host.querySelectorAll(`${section} tr > *`), (cell) => (cell as HTMLElement).dataset['label']);
    expect(labels('tbody')).toEqual(['Pair', 'Rounds', 'Wins', 'Win fraction']);
    expect(labels('tfoot')).toEqual(['Pair', '', 'Win fraction']);
  });
});
