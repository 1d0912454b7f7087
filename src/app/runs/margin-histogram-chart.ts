import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { type MarginBin, marginText, type TimingSummary } from '@shared/analysis';
import { formatCount } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';

/** A bin's edges in light times: "−0.3 to −0.2", "≤ −1.0", "> 1.0" (each bin open below, closed above). */
export function binWords({ above, upTo }: MarginBin): string {
  const tenths = (value: number) => (value < 0 ? `−${(-value).toFixed(1)}` : value.toFixed(1));
  if (above === null) return `≤ ${tenths(upTo!)}`;
  if (upTo === null) return `> ${tenths(above)}`;
  return `${tenths(above)} to ${tenths(upTo)}`;
}

/** Whether a tick of the log scale is 1, 10, 100…: only those are labelled. */
function isPowerOfTen(value: number): boolean {
  return value > 0 && Math.abs(value - 10 ** Math.round(Math.log10(value))) < 1e-9 * value;
}

/** Whether a bin holds rounds without space-like separation: every margin in it is ≤ 0. */
function notSpaceLike(bin: MarginBin): boolean {
  return bin.upTo !== null && bin.upTo <= 0;
}

/**
 * The timing check's histogram: each timed round's smaller margin, in bins of a tenth of the light
 * time d/c; the bins of rounds without space-like separation (margin ≤ 0) drawn apart, in the abort
 * tone and named in the legend. Counts on a log scale, so a handful of such rounds shows beside millions.
 */
@Component({
  selector: 'bk-margin-histogram-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `<div class="bk-margin-canvas">
      <canvas baseChart [type]="'bar'" [data]="data()" [options]="options()" role="img" [attr.aria-label]="summary()"></canvas>
    </div>
    <bk-chart-table [table]="table()" />`,
  styles: `.bk-margin-canvas { position: relative; height: 300px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarginHistogramChart {
  /** The timing check of the pair. */
  readonly timing = input.required<TimingSummary>();

  protected readonly summary = computed(() => {
    const { timedRounds, notSpaceLike: without, lightTimePs } = this.timing();
    return `Margins of ${formatCount(timedRounds)} timed rounds in tenths of the light time ${marginText(lightTimePs)}; ${formatCount(without)} without space-like separation.`;
  });

  /** A margin of `fraction` light times, in ns to the picosecond. */
  private margin(fraction: number): string {
    return marginText(Math.round(fraction * this.timing().lightTimePs));
  }

  protected readonly table = computed<ChartTable>(() => ({
    caption: `Timed rounds by the margin of their earlier outcome, in light times d/c (${marginText(this.timing().lightTimePs)}); a margin ≤ 0 is no space-like separation.`,
    columns: ['Margin (light times)', 'Margin', 'Rounds', 'Space-like'],
    rows: this.timing().histogram.map((bin) => [
      binWords(bin),
      bin.above === null ? `≤ ${this.margin(bin.upTo!)}` : bin.upTo === null ? `> ${this.margin(bin.above)}` : `${this.margin(bin.above)} to ${this.margin(bin.upTo)}`,
      formatCount(bin.rounds),
      notSpaceLike(bin) ? 'No' : 'Yes',
    ]),
  }));

  protected readonly data = computed<ChartData>(() => {
    const bins = this.timing().histogram;
    const series = (label: string, keep: (bin: MarginBin) => boolean, colour: string) => ({
      label,
      data: bins.map((bin) => (keep(bin) && bin.rounds > 0 ? bin.rounds : null)),
      backgroundColor: colour,
      borderColor: colour,
      borderWidth: 1,
      // Each bin has one series' bar: drawn full width at its place, not side by side.
      grouped: false,
    });
    return {
      labels: bins.map(binWords),
      datasets: [
        series('Without space-like separation (margin ≤ 0)', notSpaceLike, chartTone('abort')),
        series('Space-like separated (margin > 0)', (bin) => !notSpaceLike(bin), chartTone('primary')),
      ],
    };
  });

  protected readonly options = computed<ChartOptions>(() => ({
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: { legend: { position: 'bottom', labels: { boxWidth: 10, font: { size: 11 } } }, tooltip: { enabled: false } },
    scales: {
      x: { title: { display: true, text: `Margin in light times d/c (${marginText(this.timing().lightTimePs)})` }, ticks: { maxRotation: 60, autoSkip: true } },
      y: {
        type: 'logarithmic',
        // Below 1, so that a bin of a single round still shows as a bar.
        min: 0.5,
        title: { display: true, text: 'Rounds (log scale)' },
        ticks: { callback: (value) => (isPowerOfTen(Number(value)) ? formatCount(Number(value)) : '') },
      },
    },
  }));
}
