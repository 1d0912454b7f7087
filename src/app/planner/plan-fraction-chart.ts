import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import type { PlanDto } from '@shared/api';
import { formatCount, formatPercent } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';
import { percentTick } from './chart-ticks';
import { formatProbability } from './pass-look';

/** Index of the best fraction's marker among the datasets below. */
const BEST_DATASET = 2;

/** Expected finite key bits (and pass probability) against the test fraction at the chosen N, the best fraction and the planned one marked. */
@Component({
  selector: 'bk-plan-fraction-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `
    <div class="bk-plan-canvas">
      <canvas baseChart [type]="'line'" [data]="data()" [options]="options()" role="img" [attr.aria-label]="summary()"></canvas>
    </div>
    <p class="bk-plan-star" aria-hidden="true">✱ {{ bestNote() }}</p>
    <bk-chart-table [table]="table()" />
  `,
  styles: `
    .bk-plan-canvas { position: relative; height: 240px; }
    .bk-plan-star { margin: 4px 0 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); text-align: center; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanFractionChart {
  /** The whole plan. */
  readonly plan = input.required<PlanDto>();

  /** Whether some test fraction gives a positive key at this N: else there is no best one to mark. */
  private readonly anyKey = computed(() => this.plan().bestTestFraction.expectedFiniteKeyBits > 0);

  protected readonly summary = computed(() => {
    const { bestTestFraction: best, at } = this.plan();
    const most = this.anyKey()
      ? `Most key at ${formatPercent(best.testFraction, 1)} tested: ${formatCount(best.expectedFiniteKeyBits)} bits; `
      : 'No test fraction gives a positive key; ';
    return `Expected finite key against the test fraction at N = ${formatCount(at.rounds)}. ${most}the planned ${formatPercent(at.testFraction, 1)} gives ${formatCount(at.expectedFiniteKeyBits)} bits.`;
  });

  protected readonly bestNote = computed(() => {
    const best = this.plan().bestTestFraction;
    return this.anyKey()
      ? `The most key: ${formatPercent(best.testFraction, 1)} tested, ${formatCount(best.expectedFiniteKeyBits)} bits.`
      : `No test fraction gives a positive key at N = ${formatCount(this.plan().at.rounds)}: no most-key fraction to mark.`;
  });

  protected readonly table = computed<ChartTable>(() => {
    const { testFractionCurve, at } = this.plan();
    return {
      caption: `Expected finite key and pass probability against the test fraction at N = ${formatCount(at.rounds)}, the planned fraction ${formatPercent(at.testFraction, 1)}. ${this.bestNote()}`,
      columns: ['Test fraction', 'Expected finite key (bits)', 'Pass probability'],
      rows: testFractionCurve.map((point) => [formatPercent(point.testFraction, 0), formatCount(point.expectedFiniteKeyBits), formatProbability(point.passProbability)]),
    };
  });

  protected readonly data = computed<ChartData<'line', { x: number; y: number }[]>>(() => {
    const { testFractionCurve, bestTestFraction: best, at } = this.plan();
    const highest = Math.max(1, ...testFractionCurve.map((point) => point.expectedFiniteKeyBits));
    const key = chartTone('primary');
    const highlight = chartTone('threshold');
    return {
      datasets: [
        {
          label: 'Expected finite key (bits)',
          data: testFractionCurve.map((point) => ({ x: point.testFraction, y: point.expectedFiniteKeyBits })),
          yAxisID: 'bits',
          borderColor: key,
          backgroundColor: key,
          borderWidth: 2,
          pointRadius: 0,
        },
        {
          label: 'Pass probability',
          data: testFractionCurve.map((point) => ({ x: point.testFraction, y: point.passProbability })),
          yAxisID: 'pass',
          borderColor: chartTone('accept'),
          backgroundColor: chartTone('accept'),
          borderDash: [2, 2],
          borderWidth: 2,
          pointRadius: 0,
        },
        {
          label: `Best: ${formatPercent(best.testFraction, 1)}`,
          data: this.anyKey() ? [{ x: best.testFraction, y: best.expectedFiniteKeyBits }] : [],
          yAxisID: 'bits',
          showLine: false,
          pointStyle: 'star',
          pointRadius: 9,
          pointBorderWidth: 2,
          borderColor: highlight,
          backgroundColor: highlight,
        },
        {
          label: `Planned: ${formatPercent(at.testFraction, 1)}`,
          data: [
            { x: at.testFraction, y: 0 },
            { x: at.testFraction, y: highest },
          ],
          yAxisID: 'bits',
          borderColor: chartTone('invalid'),
          backgroundColor: chartTone('invalid'),
          borderDash: [6, 4],
          borderWidth: 1.5,
          pointRadius: 0,
        },
      ],
    };
  });

  protected readonly options = computed<ChartOptions<'line'>>(() => ({
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    interaction: { mode: 'nearest', intersect: false },
    plugins: {
      // Line swatches carry each line's dash; the best fraction's star is explained under the chart instead.
      legend: { position: 'bottom', labels: { boxWidth: 24, boxHeight: 1, font: { size: 11 }, filter: (item) => item.datasetIndex !== BEST_DATASET } },
      tooltip: {
        callbacks: {
          label: (item) => {
            const { x, y } = item.raw as { x: number; y: number };
            const value = item.dataset.yAxisID === 'pass' ? formatProbability(y) : `${formatCount(y)} bits`;
            return `${item.dataset.label}: ${value} at ${formatPercent(x, 1)} tested`;
          },
        },
      },
    },
    scales: {
      x: { type: 'linear', min: 0, max: 1, title: { display: true, text: 'Test fraction' }, ticks: { callback: percentTick } },
      // With no key anywhere the axis would count 0 to 1 bit in fifths: it shows its zero alone.
      bits: this.anyKey()
        ? { type: 'linear', position: 'left', beginAtZero: true, title: { display: true, text: 'Key bits' }, ticks: { callback: (value) => formatCount(Number(value)) } }
        : { type: 'linear', position: 'left', min: 0, max: 1, title: { display: true, text: 'Key bits (none)' }, ticks: { callback: (value) => (Number(value) === 0 ? '0' : '') } },
      pass: { type: 'linear', position: 'right', min: 0, max: 1, title: { display: true, text: 'Pass probability' }, grid: { display: false }, ticks: { callback: percentTick } },
    },
  }));
}
