import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartData, ChartOptions } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';

import type { GeneralKeyPoint, PlanDto } from '@shared/api';
import { formatCount, formatScientific } from '@shared/format/numbers';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone } from '../charts/chart-tones';
import { percentTick, powerOfTenTick } from './chart-ticks';
import { formatProbability } from './pass-look';

/**
 * Expected finite key bits (left, logarithmic) and pass probability (right) against the round budget
 * N on a logarithmic axis, the asymptotic key bits dashed as the limit, the chosen N marked.
 */
@Component({
  selector: 'bk-plan-rounds-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `
    <div class="bk-plan-canvas">
      <canvas baseChart [type]="'line'" [data]="data()" [options]="options" role="img" [attr.aria-label]="summary()"></canvas>
    </div>
    <bk-chart-table [table]="table()" />
  `,
  styles: `.bk-plan-canvas { position: relative; height: 280px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanRoundsChart {
  /** The whole plan. */
  readonly plan = input.required<PlanDto>();
  /** The key against general attacks over N, once the planner's workers have it. */
  readonly generalCurve = input<GeneralKeyPoint[] | undefined>(undefined);

  protected readonly summary = computed(() => {
    const { curve, at } = this.plan();
    return (
      `Expected finite key and pass probability for N from ${formatScientific(curve[0].rounds, 1)} to ${formatScientific(curve[curve.length - 1].rounds, 1)} rounds. ` +
      `At the chosen N of ${formatCount(at.rounds)}: ${formatCount(at.expectedFiniteKeyBits)} bits, pass probability ${formatProbability(at.passProbability.all)}, ` +
      `asymptotic limit ${formatCount(at.asymptoticKeyBits)} bits.` +
      (this.generalCurve() ? ' The key against general attacks is drawn beside, from the same N.' : '')
    );
  });

  /** A row for every N of either curve (the general one comes from the workers on a grid of its own); '–' where a curve has no point. */
  protected readonly table = computed<ChartTable>(() => {
    const { curve, at } = this.plan();
    const general = this.generalCurve();
    const collective = new Map(curve.map((point) => [point.rounds, point]));
    const generalBits = new Map((general ?? []).map((point) => [point.rounds, point.bits]));
    const rounds = [...new Set([...collective.keys(), ...generalBits.keys()])].sort((a, b) => a - b);
    const shown = <T>(value: T | undefined, format: (value: T) => string) => (value === undefined ? '–' : format(value));
    return {
      caption: `Expected key and pass probability against the round budget N; the chosen N is ${formatCount(at.rounds)}.`,
      columns: [
        'Rounds N',
        'Expected finite key, collective attacks (bits)',
        'Asymptotic key (bits)',
        ...(general ? ['Key against general attacks (bits)'] : []),
        'Pass probability',
      ],
      rows: rounds.map((n) => {
        const point = collective.get(n);
        return [
          formatCount(n),
          shown(point, (p) => formatCount(p.expectedFiniteKeyBits)),
          shown(point, (p) => formatCount(p.asymptoticKeyBits)),
          ...(general ? [shown(generalBits.get(n), formatCount)] : []),
          shown(point, (p) => formatProbability(p.passProbability.all)),
        ];
      }),
    };
  });

  protected readonly data = computed<ChartData<'line', { x: number; y: number | null }[]>>(() => {
    const { curve, at } = this.plan();
    const general = this.generalCurve();
    const key = chartTone('primary');
    // A logarithmic axis has no place for 0 bits: the key curves start where the key does.
    const bits = (value: number) => (value > 0 ? value : null);
    return {
      datasets: [
        {
          label: 'Expected finite key, collective attacks (bits)',
          data: curve.map((point) => ({ x: point.rounds, y: bits(point.expectedFiniteKeyBits) })),
          yAxisID: 'bits',
          borderColor: key,
          backgroundColor: key,
          borderWidth: 2,
          pointRadius: 0,
        },
        {
          label: 'Asymptotic key (limit, bits)',
          data: curve.map((point) => ({ x: point.rounds, y: bits(point.asymptoticKeyBits) })),
          yAxisID: 'bits',
          borderColor: key,
          backgroundColor: key,
          borderDash: [6, 4],
          borderWidth: 1.5,
          pointRadius: 0,
        },
        ...(general
          ? [
              {
                label: 'Key against general attacks (bits)',
                data: general.map((point) => ({ x: point.rounds, y: bits(point.bits) })),
                yAxisID: 'bits',
                borderColor: chartTone('general'),
                backgroundColor: chartTone('general'),
                borderWidth: 2,
                pointRadius: 2,
              },
            ]
          : []),
        {
          label: 'Pass probability',
          data: curve.map((point) => ({ x: point.rounds, y: point.passProbability.all })),
          yAxisID: 'pass',
          borderColor: chartTone('accept'),
          backgroundColor: chartTone('accept'),
          borderDash: [2, 2],
          borderWidth: 2,
          pointRadius: 0,
        },
        {
          label: `Chosen N = ${formatCount(at.rounds)}`,
          data: [
            { x: at.rounds, y: 0 },
            { x: at.rounds, y: 1 },
          ],
          yAxisID: 'pass',
          borderColor: chartTone('threshold'),
          backgroundColor: chartTone('threshold'),
          borderWidth: 1.5,
          pointRadius: 0,
        },
      ],
    };
  });

  protected readonly options: ChartOptions<'line'> = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    interaction: { mode: 'nearest', intersect: false },
    plugins: {
      legend: { position: 'bottom', labels: { boxWidth: 24, boxHeight: 1, font: { size: 11 } } },
      tooltip: {
        callbacks: {
          label: (item) => {
            const { x, y } = item.raw as { x: number; y: number };
            return item.dataset.yAxisID === 'pass'
              ? `${item.dataset.label}: ${formatProbability(y)} at N = ${formatCount(x)}`
              : `${item.dataset.label}: ${formatCount(y)} at N = ${formatCount(x)}`;
          },
        },
      },
    },
    scales: {
      x: { type: 'logarithmic', title: { display: true, text: 'Rounds N' }, ticks: { callback: powerOfTenTick, autoSkip: false, maxRotation: 0 } },
      bits: { type: 'logarithmic', position: 'left', title: { display: true, text: 'Key bits' }, ticks: { callback: powerOfTenTick } },
      pass: { type: 'linear', position: 'right', min: 0, max: 1, title: { display: true, text: 'Pass probability' }, grid: { display: false }, ticks: { callback: percentTick } },
    },
  };
}
