import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { LOCAL_CHSH_VALUE, QUANTUM_CHSH_VALUE } from '@shared/analysis';
import { formatFixed } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';

/** The S axis drawn, wide enough for both bounds and every value experiments report; widened for a value beyond it. */
const S_AXIS = { min: 1.6, max: 3 };

/** Tick step of the S axis. */
const S_STEP = 0.2;

/** S and its lower bound on one axis between the local bound 2 and the quantum bound 2√2. */
@Component({
  selector: 'bk-chsh-scale-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `<div class="bk-scale-canvas">
      <canvas baseChart [type]="'scatter'" [data]="data()" [options]="options()" role="img" [attr.aria-label]="summary()"></canvas>
    </div>
    <bk-chart-table [table]="table()" />`,
  styles: `.bk-scale-canvas { position: relative; height: 120px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChshScaleChart {
  /** The observed CHSH value. */
  readonly value = input.required<number | null>();
  /** S_low from the Hoeffding-corrected win fraction. */
  readonly lower = input.required<number | null>();

  protected readonly summary = computed(
    () => `S ${formatFixed(this.value(), 3)}, lower bound ${formatFixed(this.lower(), 3)}, between the local bound 2 and the quantum bound ${formatFixed(QUANTUM_CHSH_VALUE, 3)}.`,
  );

  protected readonly table = computed<ChartTable>(() => ({
    caption: 'S and its lower bound, with the bounds drawn on the axis.',
    columns: ['On the axis', 'S'],
    rows: [
      ['S observed', formatFixed(this.value(), 3)],
      ['S lower bound', formatFixed(this.lower(), 3)],
      ['Local bound', formatFixed(LOCAL_CHSH_VALUE, 3)],
      ['Quantum bound 2√2', formatFixed(QUANTUM_CHSH_VALUE, 3)],
    ],
  }));

  protected readonly data = computed<ChartData>(() => {
    const marker = (label: string, x: number | null, style: 'circle' | 'triangle', colour: string) => ({
      type: 'scatter' as const,
      label,
      data: x === null ? [] : [{ x, y: 0.5 }],
      pointStyle: style,
      pointRadius: 7,
      backgroundColor: colour,
      borderColor: colour,
    });
    const bound = (label: string, x: number, colour: string) => ({
      type: 'line' as const,
      label,
      data: [
        { x, y: 0 },
        { x, y: 1 },
      ],
      borderColor: colour,
      borderDash: [6, 4],
      borderWidth: 2,
      pointRadius: 0,
    });
    return {
      datasets: [
        marker(`S = ${formatFixed(this.value(), 3)}`, this.value(), 'circle', chartTone('primary')),
        marker(`S lower bound ${formatFixed(this.lower(), 3)}`, this.lower(), 'triangle', chartTone('threshold')),
        bound('Local bound 2', LOCAL_CHSH_VALUE, chartTone('invalid')),
        bound('Quantum bound 2√2', QUANTUM_CHSH_VALUE, chartTone('accept')),
      ],
    };
  });

  // Broken data can put S or its bound outside the usual axis (above 2√2 up to 4, or below 1.6):
  // the markers must stay on the chart, or the figure beside it reads as missing.
  private readonly axis = computed(() => {
    const shown = [this.value(), this.lower()].filter((x): x is number => x !== null && Number.isFinite(x));
    const onGrid = (x: number, round: (x: number) => number) => Number((round(x / S_STEP) * S_STEP).toFixed(1));
    return {
      min: Math.min(S_AXIS.min, ...shown.map((x) => onGrid(x - S_STEP / 2, Math.floor))),
      max: Math.max(S_AXIS.max, ...shown.map((x) => onGrid(x + S_STEP / 2, Math.ceil))),
    };
  });

  protected readonly options = computed<ChartOptions>(() => ({
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: { legend: { position: 'bottom', labels: { usePointStyle: true, boxWidth: 8, font: { size: 11 } } }, tooltip: { enabled: false } },
    scales: {
      x: { type: 'linear', ...this.axis(), ticks: { stepSize: this.axis().max - this.axis().min > 2 ? 2 * S_STEP : S_STEP, maxRotation: 0 } },
      y: { display: false, min: 0, max: 1 },
    },
  }));
}
