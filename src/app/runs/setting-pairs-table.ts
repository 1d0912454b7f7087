import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { ChshSummary } from '@shared/analysis';
import { formatScientific } from '@shared/format/numbers';
import { CardTable } from '../lists/card-table';
import { settingPairsTable } from './setting-pairs';

/** The CHSH test by setting pair: each pair's rounds, wins and bound, then the balanced figure the verdict uses. */
@Component({
  selector: 'bk-setting-pairs-table',
  imports: [CardTable],
  templateUrl: './setting-pairs-table.html',
  styleUrl: './setting-pairs-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingPairsTable {
  /** The run's CHSH summary. */
  readonly chsh = input.required<ChshSummary>();
  /** The profile's ε, at which every bound holds. */
  readonly epsilon = input.required<number>();

  protected readonly table = computed(() => settingPairsTable(this.chsh()));
  protected readonly epsilonText = computed(() => formatScientific(this.epsilon()));
}
