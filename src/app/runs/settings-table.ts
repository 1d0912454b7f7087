import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { ChshSummary, CountTable } from '@shared/analysis';
import { formatCount, formatFixed } from '@shared/format/numbers';
import { CardTable } from '../lists/card-table';

/** One cell of the settings table: setting pair (x, y), its rounds and what it is for. */
interface SettingCell {
  readonly y: number;
  readonly test: string;
  readonly generation: string;
  /** The correlator E_xy for CHSH pairs, the role of the pair otherwise. */
  readonly note: string;
}

/** The 2×3 table of settings: test and generation rounds per pair, with the correlators. */
@Component({
  selector: 'bk-settings-table',
  imports: [CardTable],
  template: `
    <table class="bk-settings" bkCardTable aria-label="Rounds per setting pair">
      <thead>
        <tr>
          <th scope="col"><span class="bk-visually-hidden">Setting of station A</span></th>
          @for (y of [0, 1, 2]; track y) {
            <th scope="col">y = {{ y }}</th>
          }
        </tr>
      </thead>
      <tbody>
        @for (row of rows(); track row.x) {
          <tr>
            <th scope="row" class="bk-card-wide">x = {{ row.x }}</th>
            @for (cell of row.cells; track cell.y) {
              <td>
                <div><span class="bk-muted">test</span> {{ cell.test }}</div>
                <div><span class="bk-muted">gen.</span> {{ cell.generation }}</div>
                <div class="bk-settings-note">{{ cell.note }}</div>
              </td>
            }
          </tr>
        }
      </tbody>
    </table>
  `,
  styles: `
    .bk-settings { width: 100%; border-collapse: collapse; }
    th, td { padding: 6px 8px; border: 1px solid var(--mat-sys-outline-variant); text-align: right; vertical-align: top; }
    th { font: var(--mat-sys-label-large); background: var(--mat-sys-surface-container-low); }
    .bk-settings-note { font: var(--mat-sys-label-medium); color: var(--mat-sys-primary); }
    /* On a phone each row is a card (bkCardTable), its heading a title across it, not a shaded cell. */
    @media (max-width: 599px) { th[scope='row'] { background: none; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsTable {
  /** Counts `[x][y][a][b]` of the test and the generation rounds. */
  readonly counts = input.required<{ test: CountTable; generation: CountTable }>();
  /** The CHSH summary, for the correlators. */
  readonly chsh = input.required<ChshSummary>();

  protected readonly rows = computed(() => {
    const { test, generation } = this.counts();
    const correlators = this.chsh().correlators;
    return [0, 1].map((x) => ({
      x,
      cells: [0, 1, 2].map((y): SettingCell => {
        const note = y < 2 ? `E${x}${y} = ${formatFixed(correlators[`E${x}${y}` as keyof typeof correlators])}` : x === 0 ? 'key setting' : 'no test, no key';
        return { y, test: formatCount(roundsOf(test, x, y)), generation: formatCount(roundsOf(generation, x, y)), note };
      }),
    }));
  });
}

function roundsOf(table: CountTable, x: number, y: number): number {
  return table[x][y].flat().reduce((sum, count) => sum + count, 0);
}
