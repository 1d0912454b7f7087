import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { type AnalysisResult, winThresholdOf } from '@shared/analysis';
import { formatCount, formatFixed, formatPercent, formatPValue, formatScientific } from '@shared/format/numbers';
import { ChshScaleChart } from './chsh-scale-chart';
import { KeyCaution } from './key-caution';
import { MissingRoundsLine } from './missing-rounds-line';

/** The figures of an analysed run, each with its bound and threshold; the key figures with their caution. */
@Component({
  selector: 'bk-run-figures',
  imports: [ChshScaleChart, KeyCaution, MatIconModule, MissingRoundsLine],
  templateUrl: './run-figures.html',
  styleUrl: './run-figures.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunFigures {
  /** The engine's result (chsh, qber and key present). */
  readonly result = input.required<AnalysisResult>();

  protected readonly chsh = computed(() => this.result().chsh!);
  protected readonly qber = computed(() => this.result().qber!);
  protected readonly key = computed(() => this.result().key!);
  protected readonly epsilon = computed(() => formatScientific(this.result().profile.epsilon));
  protected readonly winThreshold = computed(() => formatFixed(winThresholdOf(this.result())));
  protected readonly qberTolerance = computed(() => formatPercent(this.result().profile.qberTolerance));
  protected readonly pValue = computed(() => formatPValue(this.chsh().log10PValue));
  protected readonly pValueBinomial = computed(() => formatPValue(this.chsh().log10PValueBinomial));
  protected readonly pValueHoeffding = computed(() => formatPValue(this.chsh().log10PValueHoeffding));
  // Results stored before engine 2.0 lack these; they read as none.
  protected readonly winNote = computed(() => {
    const { wins, rounds, pooledWinFraction } = this.chsh();
    const missing = this.chsh().missingTestRounds ?? 0;
    const lost = missing > 0 ? `, and ${formatCount(missing)} missing test ${missing === 1 ? 'round' : 'rounds'} counted as lost` : '';
    return `Setting pairs weighed equally; ${formatCount(wins)} won of ${formatCount(rounds)} CHSH test rounds${lost} (pooled ${formatFixed(pooledWinFraction)}, for reference).`;
  });
  protected readonly finiteKeyReason = computed(() => this.key().finiteKeyReason ?? null);

  protected readonly fixed = formatFixed;
  protected readonly percent = formatPercent;
  protected readonly count = formatCount;
  protected readonly scientific = formatScientific;
}
