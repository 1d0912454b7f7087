import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { Chart, ChartData, ChartOptions, Plugin } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { LOCAL_WIN_FRACTION, QUANTUM_WIN_FRACTION } from '@shared/analysis';
import { formatFixed } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';

/** The stretch of win fractions the bar spans: a little below the local bound up to the quantum maximum. */
const AXIS = { min: LOCAL_WIN_FRACTION - 0.05, max: QUANTUM_WIN_FRACTION };

/** A row-sized bar of a run's CHSH win fraction with its threshold marked, and the figure beside it. */
@Component({
  selector: 'bk-win-fraction-bar',
  imports: [BaseChartDirective, ChartTableView],
  template: `
    <span class="bk-win-bar" role="img" [attr.aria-label]="summary()" [attr.aria-describedby]="figures.tableId">
      <span class="bk-win-canvas"><canvas baseChart [type]="'bar'" [data]="data()" [options]="options" [plugins]="plugins" aria-hidden="true"></canvas></span>
      <span class="bk-figure">{{ figure() }}</span>
    </span>
    <bk-chart-table #figures [table]="table()" hiddenTable />
  `,
  styles: `
    /* A block: inline, its hidden table (a block) split the line and a clipped ellipsis drew a dot after the figure. */
    :host { display: block; }
    .bk-win-bar { display: inline-flex; align-items: center; gap: 8px; }
    .bk-win-canvas { position: relative; display: inline-block; width: 96px; height: 18px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WinFractionBar {
  /** The observed win fraction. */
  readonly value = input.required<number>();
  /** Its acceptance threshold. */
  readonly threshold = input.required<number>();

  protected readonly figure = computed(() => formatFixed(this.value()));
  protected readonly summary = computed(
    () => `Win fraction ${formatFixed(this.value())}, ${this.value() >= this.threshold() ? 'at or above' : 'below'} the threshold ${formatFixed(this.threshold())}`,
  );

  protected readonly table = computed<ChartTable>(() => ({
    caption: 'The CHSH win fraction and the stretch the bar spans.',
    columns: ['On the bar', 'Win fraction'],
    rows: [
      ['Observed', formatFixed(this.value())],
      ['Threshold', formatFixed(this.threshold())],
      ['Bar starts at', formatFixed(AXIS.min)],
      ['Bar ends at the quantum maximum', formatFixed(AXIS.max)],
    ],
  }));

  protected readonly data = computed<ChartData>(() => ({
    labels: [''],
    datasets: [
      {
        type: 'bar',
        data: [[AXIS.min, Math.max(this.value(), AXIS.min)]] as unknown as number[],
        backgroundColor: chartTone(this.value() >= this.threshold() ? 'accept' : 'abort'),
        barPercentage: 1,
        categoryPercentage: 1,
      },
    ],
  }));

  /** Draws the threshold as a vertical tick across the bar. */
  protected readonly plugins: Plugin[] = [
    {
      id: 'bkThreshold',
      afterDatasetsDraw: (chart: Chart) => {
        const x = chart.scales['x'].getPixelForValue(this.threshold());
        const { ctx, chartArea } = chart;
        ctx.save();
        ctx.strokeStyle = chartTone('threshold');
        ctx.lineWidth = 2;
        ctx.beginPath();
        ctx.moveTo(x, chartArea.top);
        ctx.lineTo(x, chartArea.bottom);
        ctx.stroke();
        ctx.restore();
      },
    },
  ];

  protected readonly options: ChartOptions = {
    indexAxis: 'y',
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    events: [],
    plugins: { legend: { display: false }, tooltip: { enabled: false } },
    scales: { x: { display: false, ...AXIS }, y: { display: false, grid: { display: false } } },
    layout: { padding: 0 },
  };
}
