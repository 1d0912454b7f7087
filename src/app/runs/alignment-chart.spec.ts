import { TestBed } from '@angular/core/testing';

import type { AlignmentSummary } from '@shared/analysis';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { AlignmentChart } from './alignment-chart';

/** A pair whose station B record runs 3 rounds behind: at −3 S is 2.71, elsewhere about 0 (five offsets of the 33 shown). */
const SHIFTED: AlignmentSummary = {
  centre: 0,
  significance: 1e-6,
  roundsRead: 12_000,
  shifted: true,
  bestOffset: -3,
  sentence: "Station B's record runs 3 rounds behind station A's: at that offset S = 2.71, at zero 0.02.",
  series: [
    { offset: -4, chshValue: -0.03, lower: 0, upper: 0.41 },
    { offset: -3, chshValue: 2.7134, lower: 2.3, upper: 3.12 },
    { offset: -2, chshValue: 0.05, lower: 0, upper: 0.46 },
    { offset: -1, chshValue: null, lower: 0, upper: 4 },
    { offset: 0, chshValue: 0.0214, lower: 0, upper: 0.43 },
  ],
};

describe('AlignmentChart', () => {
  beforeAll(() => {
    // jsdom has no canvas: the chart then draws nothing, and its text equivalent is what is tested.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  it('gives every offset as a row, S with where |S| lies, naming the centre and the offset that fits clearly better', () => {
    TestBed.configureTestingModule({ providers: [CHART_PROVIDERS] });
    const fixture = TestBed.createComponent(AlignmentChart);
    fixture.componentRef.setInput('alignment', SHIFTED);
    fixture.detectChanges();
    const host = fixture.nativeElement as HTMLElement;
    const table = host.querySelector('bk-chart-table table')!;

    expect(host.querySelector('canvas')!.getAttribute('aria-label')).toBe(SHIFTED.sentence);
    expect(table.querySelector('caption')!.textContent).toBe(
      'S at each record offset k (station A’s round r with station B’s round r + k) and where |S| lies, all offsets at once with probability 1 − 1e-6.',
    );
    expect(Array.from(table.querySelectorAll('tbody tr'), (row) => Array.from(row.children, (cell) => cell.textContent.trim()))).toEqual([
      ['−4', '−0.030', '0.000', '0.410', '–'],
      ['−3', '2.713', '2.300', '3.120', 'Best other offset: fits clearly better'],
      ['−2', '0.050', '0.000', '0.460', '–'],
      ['−1', '–', '0.000', '4.000', '–'],
      ['0', '0.021', '0.000', '0.430', 'Centre (as written)'],
    ]);
  });
});
