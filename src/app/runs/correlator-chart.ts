import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import type { ChshSummary } from '@shared/analysis';
import { formatFixed } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';

/** Each correlator of ideal devices, 1/√2 (E11 at −1/√2, drawn as −E11). */
const IDEAL_CORRELATOR = Math.SQRT1_2;

/** The bars, in their order. */
const CORRELATOR_LABELS = ['E00', 'E01', 'E10', '−E11'];

/** E00, E01, E10 and −E11 as bars, with the ideal 1/√2 dashed: S is their sum. */
@Component({
  selector: 'bk-correlator-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `<div class="bk-correlator-canvas">
      <canvas baseChart [type]="'bar'" [data]="data()" [options]="options" role="img" [attr.aria-label]="summary()"></canvas>
    </div>
    <bk-chart-table [table]="table()" />`,
  styles: `.bk-correlator-canvas { position: relative; height: 180px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CorrelatorChart {
  /** The CHSH summary holding the correlators. */
  readonly chsh = input.required<ChshSummary>();

  private readonly values = computed(() => {
    const { E00, E01, E10, E11 } = this.chsh().correlators;
    return [E00, E01, E10, E11 === null ? null : -E11];
  });

  protected readonly summary = computed(
    () =>
      `Correlators E00, E01, E10 and −E11: ${this.values()
        .map((value) => formatFixed(value))
        .join(', ')}; ideal ${formatFixed(IDEAL_CORRELATOR)}.`,
  );

  protected readonly table = computed<ChartTable>(() => ({
    caption: `The correlators, whose sum is S, against the ideal ${formatFixed(IDEAL_CORRELATOR)} (1/√2).`,
    columns: ['Correlator', 'Observed', 'Ideal'],
    rows: CORRELATOR_LABELS.map((label, index) => [label, formatFixed(this.values()[index]), formatFixed(IDEAL_CORRELATOR)]),
  }));

  protected readonly data = computed<ChartData>(() => ({
    labels: CORRELATOR_LABELS,
    datasets: [
      { type: 'bar', label: 'Observed', data: this.values(), backgroundColor: chartTone('primary'), barPercentage: 0.6, order: 1 },
      {
        type: 'line',
        label: 'Ideal 1/√2',
        data: this.values().map(() => IDEAL_CORRELATOR),
        borderColor: chartTone('accept'),
        borderDash: [6, 4],
        pointRadius: 0,
        order: 0,
      },
    ],
  }));

  protected readonly options: ChartOptions = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: { legend: { position: 'bottom', labels: { boxWidth: 10, font: { size: 11 } } } },
    scales: { y: { min: 0, max: 1 }, x: { grid: { display: false } } },
  };
}
