import { TestBed } from '@angular/core/testing';

import { type AnalysisProfile, parseProfile } from '@shared/analysis';
import { planRounds } from '@shared/planner/plan-rounds';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { PlanFractionChart } from './plan-fraction-chart';

const nightly = (parseProfile({ testSelection: { mode: 'fixed-fraction', fraction: 0.5 }, chshTolerance: 0.03, qberTolerance: 0.05 }) as { profile: AnalysisProfile }).profile;

/** The chart of the plan for a device at 2·10^6 rounds: its note under the chart, its text for screen readers and its table's rows. */
function shown(winFraction: number): { note: string; summary: string; rows: string[][] } {
  TestBed.configureTestingModule({ providers: [CHART_PROVIDERS] });
  const fixture = TestBed.createComponent(PlanFractionChart);
  fixture.componentRef.setInput('plan', planRounds({ device: { winFraction, qber: 0.02, trialRate: 2000 }, profile: nightly, rounds: 2_000_000 }));
  fixture.detectChanges();
  const host = fixture.nativeElement as HTMLElement;
  return {
    note: host.querySelector('.bk-plan-star')!.textContent.trim(),
    summary: host.querySelector('canvas')!.getAttribute('aria-label')!,
    rows: Array.from(host.querySelectorAll('bk-chart-table tbody tr'), (row) => Array.from(row.children, (cell) => cell.textContent.trim())),
  };
}

describe('PlanFractionChart', () => {
  beforeAll(() => {
    // jsdom has no canvas: the chart then draws nothing, and its words are what is tested.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  it('marks the fraction that gives the most key', () => {
    const { note, summary } = shown(0.84);
    expect(note).toMatch(/^✱ The most key: \d+(\.\d)?\u2009?% tested, [\d\u2009]+ bits\.$/);
    expect(summary).toContain('Most key at');
  });

  it('gives its curve as a table, a row for each test fraction from 2 % to 98 %', () => {
    const { rows } = shown(0.84);
    expect(rows).toHaveLength(49);
    expect(rows[0][0]).toBe('2\u2009%');
    expect(rows[48][0]).toBe('98\u2009%');
    // The key and the pass probability at each fraction, as the tooltips word them.
    for (const row of rows) expect(row.slice(1)).toEqual([expect.stringMatching(/^[\d\u2009]+$/), expect.stringMatching(/^([<>] )?\d+\.\d\u2009%$/)]);
  });

  it('says that no fraction gives a key rather than marking a most key of 0 bits', () => {
    // Below the classical bound of 0.75 no test fraction leaves any key.
    const { note, summary } = shown(0.74);
    expect(note).toBe('✱ No test fraction gives a positive key at N = 2\u2009000\u2009000: no most-key fraction to mark.');
    expect(summary).toContain('No test fraction gives a positive key');
    expect(summary).not.toContain('Most key');
  });
});
