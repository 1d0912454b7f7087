import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData, ChartOptions, PointStyle } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { type BlockSummary, type FractionInterval, LOCAL_WIN_FRACTION, QUANTUM_WIN_FRACTION } from '@shared/analysis';
import { formatFixed, formatPercent } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';

/** A block's value against a threshold: which side of it counts as a failure. */
type FailingSide = 'below' | 'above';

/** One panel of the drift chart: per-block values with their intervals and the lines drawn in. */
interface DriftPanel {
  readonly data: ChartData;
  readonly options: ChartOptions;
  readonly summary: string;
}

/**
 * The stationarity plot: per-block CHSH win fraction and key-setting QBER as points with their
 * Hoeffding intervals, the acceptance thresholds, the quantum maximum and the local bound dashed;
 * blocks whose observed value is on the failing side of the threshold are drawn as crosses.
 */
@Component({
  selector: 'bk-drift-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `
    @if (blocks().length === 0) {
      <p class="bk-muted">No blocks to plot: the log had no readable rounds.</p>
    } @else {
      <figure class="bk-drift-panel">
        <figcaption>CHSH win fraction per block</figcaption>
        <div class="bk-drift-canvas">
          <canvas baseChart [type]="'bar'" [data]="win().data" [options]="win().options" role="img" [attr.aria-label]="win().summary"></canvas>
        </div>
      </figure>
      <figure class="bk-drift-panel">
        <figcaption>QBER per block</figcaption>
        <div class="bk-drift-canvas">
          <canvas baseChart [type]="'bar'" [data]="qber().data" [options]="qber().options" role="img" [attr.aria-label]="qber().summary"></canvas>
        </div>
      </figure>
      <bk-chart-table [table]="table()" />
    }
  `,
  styles: `
    .bk-drift-panel { margin: 0 0 12px; }
    figcaption { font: var(--mat-sys-label-large); margin-bottom: 4px; }
    .bk-drift-canvas { position: relative; height: 220px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DriftChart {
  /** The run's blocks. */
  readonly blocks = input.required<BlockSummary[]>();
  /** The acceptance threshold of the win fraction, ω_Q − tolerance. */
  readonly winThreshold = input.required<number>();
  /** The profile's QBER tolerance. */
  readonly qberTolerance = input.required<number>();

  protected readonly win = computed(() =>
    panel(
      this.blocks().map((block) => block.chsh),
      'below',
      this.winThreshold(),
      formatFixed,
      [
        { label: `Threshold ${formatFixed(this.winThreshold())}`, value: this.winThreshold(), colour: chartTone('threshold') },
        { label: 'Quantum maximum (2+√2)/4', value: QUANTUM_WIN_FRACTION, colour: chartTone('accept') },
        { label: 'Local bound 3/4', value: LOCAL_WIN_FRACTION, colour: chartTone('invalid') },
      ],
      { ...winRange(this.blocks()), beginAtZero: false },
    ),
  );

  /** Both panels' blocks as one table, a block a row. */
  protected readonly table = computed<ChartTable>(() => {
    const winThreshold = this.winThreshold();
    const qberTolerance = this.qberTolerance();
    const interval = ({ lower, upper }: FractionInterval, format: (value: number) => string) => (lower === null || upper === null ? '–' : `${format(lower)} to ${format(upper)}`);
    return {
      caption: `Each block's CHSH win fraction (threshold ${formatFixed(winThreshold)}) and QBER (tolerance ${formatPercent(qberTolerance)}), with their Hoeffding intervals.`,
      columns: ['Block', 'Win fraction', 'Interval', 'QBER', 'Interval', 'Outside the threshold'],
      rows: this.blocks().map(({ chsh, qber }, index) => {
        const outside = [outsideThreshold(chsh, 'below', winThreshold) ? 'win fraction' : '', outsideThreshold(qber, 'above', qberTolerance) ? 'QBER' : ''];
        return [
          String(index + 1),
          formatFixed(chsh.fraction),
          interval(chsh, formatFixed),
          formatPercent(qber.fraction),
          interval(qber, formatPercent),
          outside.filter(Boolean).join(' and ') || '–',
        ];
      }),
    };
  });

  protected readonly qber = computed(() =>
    panel(
      this.blocks().map((block) => block.qber),
      'above',
      this.qberTolerance(),
      formatPercent,
      [{ label: `Tolerance ${formatPercent(this.qberTolerance())}`, value: this.qberTolerance(), colour: chartTone('threshold') }],
      { beginAtZero: true },
    ),
  );
}

/** A horizontal line across every block. */
interface Guide {
  readonly label: string;
  readonly value: number;
  readonly colour: string;
}

function panel(
  intervals: FractionInterval[],
  failing: FailingSide,
  threshold: number,
  format: (value: number) => string,
  guides: Guide[],
  range: { min?: number; max?: number; beginAtZero: boolean },
): DriftPanel {
  const fails = intervals.map((interval) => outsideThreshold(interval, failing, threshold));
  const primary = chartTone('primary');
  const abort = chartTone('abort');
  const pointStyle: PointStyle[] = fails.map((fail) => (fail ? 'crossRot' : 'circle'));
  const data: ChartData = {
    labels: intervals.map((_, index) => String(index + 1)),
    datasets: [
      {
        type: 'line',
        label: 'Observed (× outside the threshold)',
        data: intervals.map(({ fraction }) => fraction),
        showLine: false,
        pointStyle,
        pointRadius: fails.map((fail) => (fail ? 7 : 4)),
        pointBorderWidth: fails.map((fail) => (fail ? 2.5 : 1)),
        pointBackgroundColor: fails.map((fail) => (fail ? abort : primary)),
        pointBorderColor: fails.map((fail) => (fail ? abort : primary)),
        order: 0,
      },
      {
        type: 'bar',
        label: 'Hoeffding interval',
        data: intervals.map(({ lower, upper }) => (lower === null || upper === null ? null : [lower, upper])) as unknown as number[],
        backgroundColor: `${primary}40`,
        borderColor: primary,
        borderWidth: 1,
        barThickness: 6,
        order: 1,
      },
      ...guides.map((guide) => ({
        type: 'line' as const,
        label: guide.label,
        data: intervals.map(() => guide.value),
        borderColor: guide.colour,
        borderDash: [6, 4],
        borderWidth: 1.5,
        pointRadius: 0,
        fill: false,
        order: 2,
      })),
    ],
  };
  const options: ChartOptions = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: {
      legend: { position: 'bottom', labels: { usePointStyle: true, boxWidth: 8, font: { size: 11 } } },
      tooltip: {
        callbacks: {
          label: (item) => {
            const interval = intervals[item.dataIndex];
            return item.datasetIndex === 0 && interval.fraction !== null
              ? `${format(interval.fraction)} over ${interval.rounds} test rounds (${format(interval.lower ?? 0)} to ${format(interval.upper ?? 1)})`
              : `${item.dataset.label ?? ''}`;
          },
        },
      },
    },
    scales: {
      x: { title: { display: true, text: 'Block of consecutive rounds' }, grid: { display: false } },
      y: { ...range, ticks: { callback: (value) => format(Number(value)) } },
    },
  };
  const failingBlocks = fails.flatMap((fail, index) => (fail ? [index + 1] : []));
  const summary =
    `${intervals.length} blocks, observed from ${format(Math.min(...observed(intervals)))} to ${format(Math.max(...observed(intervals)))}; ` +
    (failingBlocks.length === 0 ? 'every block on the passing side of the threshold.' : `blocks ${failingBlocks.join(', ')} outside the threshold.`);
  return { data, options, summary };
}

/** Whether a block's observed value is on the failing side of its threshold. */
function outsideThreshold({ fraction }: FractionInterval, failing: FailingSide, threshold: number): boolean {
  return fraction !== null && (failing === 'below' ? fraction < threshold : fraction > threshold);
}

function observed(intervals: FractionInterval[]): number[] {
  return intervals.flatMap(({ fraction }) => (fraction === null ? [] : [fraction]));
}

/** The win-fraction axis: the local bound to just above the quantum maximum, widened to every interval. */
function winRange(blocks: BlockSummary[]): { min: number; max: number } {
  const lowest = Math.min(LOCAL_WIN_FRACTION - 0.02, ...blocks.flatMap(({ chsh }) => (chsh.lower === null ? [] : [chsh.lower])));
  const highest = Math.max(QUANTUM_WIN_FRACTION + 0.02, ...blocks.flatMap(({ chsh }) => (chsh.upper === null ? [] : [chsh.upper])));
  return { min: Math.floor(lowest * 50) / 50, max: Math.ceil(highest * 50) / 50 };
}
