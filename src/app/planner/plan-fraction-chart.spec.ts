import { TestBed } from '@angular/core/testing';

import { type AnalysisProfile, parseProfile } from '@shared/analysis';
import { planRounds } from '@shared/planner/plan-rounds';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { PlanFractionChart } from './plan-fraction-chart';

const nightly = (parseProfile({ testSelection: { mode: 'fixed-fraction', fraction: 0.5 }, chshTolerance: 0.03, qberTolerance: 0.05 }) as { profile: AnalysisProfile }).profile;

/** The chart of the plan for a device at 2·10^6 rounds: its note under the chart and its text for screen readers. */
function shown(winFraction: number): { note: string; summary: string } {
  TestBed.configureTestingModule({ providers: [CHART_PROVIDERS] });
  const fixture = TestBed.createComponent(PlanFractionChart);
  fixture.componentRef.setInput('plan', planRounds({ device: { winFraction, qber: 0.02, trialRate: 2000 }, profile: nightly, rounds: 2_000_000 }));
  fixture.detectChanges();
  const host = fixture.nativeElement as HTMLElement;
  return { note: host.querySelector('.bk-plan-star')!.textContent.trim(), summary: host.querySelector('canvas')!.getAttribute('aria-label')! };
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

  it('says that no fraction gives a key rather than marking a most key of 0 bits', () => {
    // Below the classical bound of 0.75 no test fraction leaves any key.
    const { note, summary } = shown(0.74);
    expect(note).toBe('✱ No test fraction gives a positive key at N = 2\u2009000\u2009000: no most-key fraction to mark.');
    expect(summary).toContain('No test fraction gives a positive key');
    expect(summary).not.toContain('Most key');
  });
});
