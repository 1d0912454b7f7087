import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import { type AlignmentSummary, QUANTUM_CHSH_VALUE, signedRounds } from '@shared/analysis';
import { formatFixed, formatScientific } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';

/** |S| never exceeds 4: the top of the axis at most. */
const LARGEST_ABSOLUTE_S = 4;

/**
 * The alignment check as a chart: |S| at each record offset k with its interval (all offsets at
 * once, 1 − α) as a band, the centre (zero, or the stated offset) as a dashed upright line and the
 * upper end of its interval as a dashed level: an offset whose band lies wholly above that level
 * fits clearly better, and is marked.
 */
@Component({
  selector: 'bk-alignment-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `<div class="bk-alignment-canvas">
      <canvas baseChart [type]="'line'" [data]="data()" [options]="options()" role="img" [attr.aria-label]="alignment().sentence"></canvas>
    </div>
    <bk-chart-table [table]="table()" />`,
  styles: `.bk-alignment-canvas { position: relative; height: 260px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AlignmentChart {
  /** The alignment check of the pair. */
  readonly alignment = input.required<AlignmentSummary>();

  private readonly centreUpper = computed(() => this.alignment().series.find((point) => point.offset === this.alignment().centre)?.upper ?? null);

  /** What each offset is on the chart, beyond its figures. */
  private noteOf(offset: number): string {
    const { centre, bestOffset, shifted } = this.alignment();
    if (offset === centre) return centre === 0 ? 'Centre (as written)' : 'Centre (stated offset)';
    if (offset === bestOffset) return shifted ? 'Best other offset: fits clearly better' : 'Best other offset';
    return '';
  }

  protected readonly table = computed<ChartTable>(() => {
    const { series, significance } = this.alignment();
    return {
      caption: `S at each record offset k (station A’s round r with station B’s round r + k) and where |S| lies, all offsets at once with probability 1 − ${formatScientific(significance)}.`,
      columns: ['Offset k', 'S', '|S| from', '|S| to', 'On the chart'],
      rows: series.map((point) => [
        signedRounds(point.offset),
        formatFixed(point.chshValue, 3).replace('-', '−'),
        formatFixed(point.lower, 3),
        formatFixed(point.upper, 3),
        this.noteOf(point.offset) || '–',
      ]),
    };
  });

  protected readonly data = computed<ChartData>(() => {
    const { series, centre, bestOffset, shifted } = this.alignment();
    const primary = chartTone('primary');
    const top = this.axisTop();
    const centreUpper = this.centreUpper();
    const bestS = series.find((point) => point.offset === bestOffset)?.chshValue ?? null;
    return {
      datasets: [
        {
          label: '',
          data: series.map((point) => ({ x: point.offset, y: point.upper })),
          borderWidth: 0,
          pointRadius: 0,
          fill: false,
        },
        {
          label: 'Interval of |S|',
          data: series.map((point) => ({ x: point.offset, y: point.lower })),
          borderWidth: 0,
          pointRadius: 0,
          backgroundColor: `${primary}33`,
          fill: '-1',
        },
        {
          label: '|S| observed',
          data: series.flatMap((point) => (point.chshValue === null ? [] : [{ x: point.offset, y: Math.abs(point.chshValue) }])),
          borderColor: primary,
          backgroundColor: primary,
          borderWidth: 1,
          pointRadius: 3,
        },
        {
          label: centre === 0 ? 'Centre: the records as written' : `Centre: the stated offset ${signedRounds(centre)}`,
          data: [
            { x: centre, y: 0 },
            { x: centre, y: top },
          ],
          borderColor: chartTone('invalid'),
          borderDash: [6, 4],
          borderWidth: 1.5,
          pointRadius: 0,
        },
        ...(centreUpper === null
          ? []
          : [
              {
                label: 'Upper end at the centre',
                data: [
                  { x: series[0].offset, y: centreUpper },
                  { x: series[series.length - 1].offset, y: centreUpper },
                ],
                borderColor: chartTone('threshold'),
                borderDash: [2, 3],
                borderWidth: 1.5,
                pointRadius: 0,
              },
            ]),
        ...(shifted && bestS !== null
          ? [
              {
                label: `Fits clearly better: ${signedRounds(bestOffset)}`,
                data: [{ x: bestOffset, y: Math.abs(bestS) }],
                showLine: false,
                pointStyle: 'crossRot' as const,
                pointRadius: 9,
                pointBorderWidth: 2.5,
                borderColor: chartTone('abort'),
                backgroundColor: chartTone('abort'),
              },
            ]
          : []),
      ],
    };
  });

  /** The top of the |S| axis: the next half above the quantum bound and every interval, at most 4. */
  private readonly axisTop = computed(() => {
    const highest = Math.max(QUANTUM_CHSH_VALUE, ...this.alignment().series.map((point) => point.upper));
    return Math.min(LARGEST_ABSOLUTE_S, Math.ceil(highest * 2) / 2);
  });

  protected readonly options = computed<ChartOptions>(() => {
    const { series } = this.alignment();
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      plugins: {
        legend: { position: 'bottom', labels: { usePointStyle: true, boxWidth: 8, font: { size: 11 }, filter: (item) => item.text !== '' } },
        tooltip: { enabled: false },
      },
      scales: {
        x: {
          type: 'linear',
          min: series[0]?.offset,
          max: series[series.length - 1]?.offset,
          title: { display: true, text: 'Record offset k: station A’s round r with station B’s round r + k' },
          ticks: { stepSize: 2, callback: (value) => signedRounds(Number(value)) },
        },
        y: { min: 0, max: this.axisTop(), title: { display: true, text: '|S|' }, ticks: { stepSize: 0.5 } },
      },
    };
  });
}
