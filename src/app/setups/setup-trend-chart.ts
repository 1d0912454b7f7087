import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { ChartData, ChartOptions, PointStyle } from 'chart.js';
import { BaseChartDirective } from 'ng2-charts';
import { switchMap } from 'rxjs';

import type { RunSummaryDto, Verdict } from '@shared/api';
import { formatFixed, formatPercent } from '@shared/format/numbers';
import { loaded } from '../api/loaded';
import { type ChartTable, ChartTableView } from '../charts/chart-table';
import { chartTone, type ChartTone } from '../charts/chart-tones';
import { RunsApi } from '../runs/runs-api';
import { lookOfVerdict } from '../runs/verdict-look';

/** How far back the trend reaches. */
const TREND_DAYS = 42;

/** Shape and tone of each verdict's points: never the colour alone. */
const VERDICT_MARKS: Record<Verdict, { style: PointStyle; tone: ChartTone }> = {
  ACCEPT: { style: 'circle', tone: 'accept' },
  ABORT: { style: 'crossRot', tone: 'abort' },
  INVALID: { style: 'rect', tone: 'invalid' },
};

/** The runs of one setup over the last weeks: S and QBER per night, each point shaped and coloured by its verdict. */
@Component({
  selector: 'bk-setup-trend-chart',
  imports: [BaseChartDirective, ChartTableView],
  template: `
    @switch (runs().status) {
      @case ('loading') {
        <p class="bk-muted">Loading the last weeks’ runs…</p>
      }
      @case ('failed') {
        <p role="alert">The trend could not be loaded.</p>
      }
      @case ('ready') {
        @if (analysed().length === 0) {
          <p class="bk-muted" data-testid="trend-empty">No analysed run in the last {{ days }} days. Runs appear here once they have a verdict.</p>
        } @else {
          <div class="bk-trend-canvas">
            <canvas baseChart [type]="'line'" [data]="data()" [options]="options" role="img" [attr.aria-label]="summary()"></canvas>
          </div>
          <p class="bk-trend-legend">
            @for (mark of legend; track mark.word) {
              <span>{{ mark.symbol }} {{ mark.word }}</span>
            }
          </p>
          <bk-chart-table [table]="table()" />
        }
      }
    }
  `,
  styles: `
    .bk-trend-canvas { position: relative; height: 220px; }
    .bk-trend-legend { display: flex; gap: 16px; margin: 4px 0 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupTrendChart {
  private readonly runsApi = inject(RunsApi);

  /** The setup's id. */
  readonly setupId = input.required<number>();

  protected readonly days = TREND_DAYS;
  protected readonly legend = [
    { symbol: '●', word: lookOfVerdict('ACCEPT').word },
    { symbol: '✕', word: lookOfVerdict('ABORT').word },
    { symbol: '■', word: lookOfVerdict('INVALID').word },
  ];

  protected readonly runs = toSignal(
    toObservable(this.setupId).pipe(
      switchMap((setupId) => {
        const from = new Date(Date.now() - TREND_DAYS * 86_400_000).toISOString().slice(0, 10);
        return loaded(this.runsApi.list({ setupId, from, page: 0, pageSize: 200, sort: 'acquiredOn', direction: 'asc' }));
      }),
    ),
    { initialValue: { status: 'loading' } },
  );

  /** Runs with a verdict and figures, oldest night first. */
  protected readonly analysed = computed(() => {
    const runs = this.runs();
    const items: RunSummaryDto[] = runs.status === 'ready' ? runs.value.items : [];
    return items.filter((run) => run.verdict !== null && run.chshValue !== null).sort((a, b) => night(a).localeCompare(night(b)));
  });

  protected readonly summary = computed(() => {
    const runs = this.analysed();
    const count = (verdict: Verdict) => runs.filter((run) => run.verdict === verdict).length;
    return `${runs.length} runs in the last ${TREND_DAYS} days: ${count('ACCEPT')} accepted, ${count('ABORT')} aborted, ${count('INVALID')} invalid.`;
  });

  protected readonly table = computed<ChartTable>(() => ({
    caption: `S and QBER of each analysed run of the last ${TREND_DAYS} days, oldest night first.`,
    columns: ['Night', 'Run', 'Verdict', 'S', 'QBER'],
    rows: this.analysed().map((run) => [night(run), String(run.id), lookOfVerdict(run.verdict!).word, formatFixed(run.chshValue, 3), formatPercent(run.qber)]),
  }));

  protected readonly data = computed<ChartData>(() => {
    const runs = this.analysed();
    const marks = runs.map((run) => VERDICT_MARKS[run.verdict!]);
    const colours = marks.map((mark) => chartTone(mark.tone));
    const series = (label: string, values: (number | null)[], axis: 'y' | 'qber', dash: number[]) => ({
      label,
      data: values,
      yAxisID: axis,
      borderColor: chartTone(axis === 'y' ? 'primary' : 'threshold'),
      borderDash: dash,
      borderWidth: 1.5,
      pointStyle: marks.map((mark) => mark.style),
      pointRadius: 5,
      pointBorderWidth: 2,
      pointBackgroundColor: colours,
      pointBorderColor: colours,
    });
    return {
      labels: runs.map(night),
      datasets: [
        series(
          'S',
          runs.map((run) => run.chshValue),
          'y',
          [],
        ),
        series(
          'QBER',
          runs.map((run) => run.qber),
          'qber',
          [4, 3],
        ),
      ],
    };
  });

  protected readonly options: ChartOptions = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    plugins: {
      legend: { position: 'bottom', labels: { boxWidth: 24, boxHeight: 1, font: { size: 11 } } },
      tooltip: {
        callbacks: {
          label: (item) => {
            const run = this.analysed()[item.dataIndex];
            const value = item.datasetIndex === 0 ? `S ${formatFixed(run.chshValue, 3)}` : `QBER ${formatPercent(run.qber)}`;
            return `${value} · run ${run.id} · ${lookOfVerdict(run.verdict!).word}`;
          },
        },
      },
    },
    scales: {
      x: { grid: { display: false } },
      y: { position: 'left', title: { display: true, text: 'S' }, suggestedMin: 2, suggestedMax: 2.85 },
      qber: {
        position: 'right',
        title: { display: true, text: 'QBER' },
        min: 0,
        suggestedMax: 0.1,
        grid: { display: false },
        ticks: { callback: (value) => formatPercent(Number(value), 0) },
      },
    },
  };
}

/** The night a run belongs to: its acquisition date, else its upload date. */
function night(run: RunSummaryDto): string {
  return run.acquiredOn ?? run.createdAt.slice(0, 10);
}
