import { TestBed } from '@angular/core/testing';

import type { MarginBin, TimingSummary } from '@shared/analysis';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { binWords, MarginHistogramChart } from './margin-histogram-chart';

/** Four of the 22 bins: the open one below −1, the last bin without space-like separation, the first with it, the open one above 1. */
const BINS: MarginBin[] = [
  { above: null, upTo: -1, rounds: 2 },
  { above: -0.1, upTo: 0, rounds: 113 },
  { above: 0, upTo: 0.1, rounds: 40 },
  { above: 1, upTo: null, rounds: 11_845 },
];

const TIMING: TimingSummary = {
  lightTimePs: 4_336_333,
  clockOffsetPs: 0,
  clockUncertaintyPs: 2_000,
  timedRounds: 12_000,
  untimedRounds: 0,
  notSpaceLike: 115,
  notSpaceLikeShare: 115 / 12_000,
  firstNotSpaceLike: [17],
  smallestMargin: { round: 1963, station: 'B', picoseconds: -5_266_768 },
  histogram: BINS,
};

describe('MarginHistogramChart', () => {
  beforeAll(() => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  it('words each bin by its edges in light times, the lower one open and the upper one closed', () => {
    expect(BINS.map(binWords)).toEqual(['≤ −1.0', '−0.1 to 0.0', '0.0 to 0.1', '> 1.0']);
  });

  it('gives the bins as a table with their margins in ns, saying which lack space-like separation', () => {
    TestBed.configureTestingModule({ providers: [CHART_PROVIDERS] });
    const fixture = TestBed.createComponent(MarginHistogramChart);
    fixture.componentRef.setInput('timing', TIMING);
    fixture.detectChanges();
    const table = (fixture.nativeElement as HTMLElement).querySelector('bk-chart-table table')!;
    const rows = Array.from(table.querySelectorAll('tbody tr'), (row) => Array.from(row.children, (cell) => cell.textContent.trim().replaceAll('\u2009', ' ')));
    // A tenth of the light time: 433 633.3 ps, rounded to 433.633 ns.
    expect(rows).toEqual([
      ['≤ −1.0', '≤ −4 336.333 ns', '2', 'No'],
      ['−0.1 to 0.0', '−433.633 ns to 0.000 ns', '113', 'No'],
      ['0.0 to 0.1', '0.000 ns to 433.633 ns', '40', 'Yes'],
      ['> 1.0', '> 4 336.333 ns', '11 845', 'Yes'],
    ]);
  });
});
