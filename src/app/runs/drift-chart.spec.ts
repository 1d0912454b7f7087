import { TestBed } from '@angular/core/testing';

import type { BlockSummary, FractionInterval } from '@shared/analysis';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { DriftChart } from './drift-chart';

/** An interval as the engine states it, with a fixed ± 0.02 around the fraction. */
const interval = (rounds: number, hits: number): FractionInterval => ({ rounds, hits, fraction: hits / rounds, lower: hits / rounds - 0.02, upper: hits / rounds + 0.02 });

/** Three blocks of an invented night: a steady one, one losing too many games, one with too many errors. */
const BLOCKS: BlockSummary[] = [
  { index: 0, firstRound: 0, lastRound: 999, chsh: interval(1000, 850), qber: interval(500, 10) },
  { index: 1, firstRound: 1000, lastRound: 1999, chsh: interval(1000, 780), qber: interval(500, 12) },
  { index: 2, firstRound: 2000, lastRound: 2999, chsh: interval(1000, 848), qber: interval(500, 40) },
];

describe('DriftChart', () => {
  beforeAll(() => {
    // jsdom has no canvas: the chart then draws nothing, and its text equivalent is what is tested.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  it('gives both panels as one table, a block a row, naming the side of each threshold a block falls outside', () => {
    TestBed.configureTestingModule({ providers: [CHART_PROVIDERS] });
    const fixture = TestBed.createComponent(DriftChart);
    fixture.componentRef.setInput('blocks', BLOCKS);
    fixture.componentRef.setInput('winThreshold', 0.8236);
    fixture.componentRef.setInput('qberTolerance', 0.05);
    fixture.detectChanges();
    const table = (fixture.nativeElement as HTMLElement).querySelector('bk-chart-table table')!;

    expect(table.querySelector('caption')!.textContent).toBe("Each block's CHSH win fraction (threshold 0.8236) and QBER (tolerance 5.00\u2009%), with their Hoeffding intervals.");
    expect(Array.from(table.querySelectorAll('tbody tr'), (row) => Array.from(row.children, (cell) => cell.textContent.trim()))).toEqual([
      ['1', '0.8500', '0.8300 to 0.8700', '2.00\u2009%', '0.00\u2009% to 4.00\u2009%', '–'],
      ['2', '0.7800', '0.7600 to 0.8000', '2.40\u2009%', '0.40\u2009% to 4.40\u2009%', 'win fraction'],
      ['3', '0.8480', '0.8280 to 0.8680', '8.00\u2009%', '6.00\u2009% to 10.00\u2009%', 'QBER'],
    ]);
  });
});
