import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { AnalysisResult } from '../../../shared/analysis/result';
import { formatCount, formatFixed, formatLog10, formatPercent, formatScientific } from '../../../shared/format/numbers';
import { ChshScaleChart } from './chsh-scale-chart';
import { KeyCaution } from './key-caution';
import { winThresholdOf } from '../../../shared/analysis/report/win-threshold';

/** The figures of an analysed run, each with its bound and threshold; the key figures with their caution. */
@Component({
  selector: 'bk-run-figures',
  imports: [ChshScaleChart, KeyCaution],
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
  protected readonly pValue = computed(() => formatLog10(this.chsh().log10PValue));
  protected readonly pValueHoeffding = computed(() => formatLog10(this.chsh().log10PValueHoeffding));

  protected readonly fixed = formatFixed;
  protected readonly percent = formatPercent;
  protected readonly count = formatCount;
}
