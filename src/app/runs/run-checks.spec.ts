import { ComponentFixture, TestBed } from '@angular/core/testing';

import { type CheckResult, parseProfile, type SecuritySummary } from '@shared/analysis';
import { RunChecks } from './run-checks';

const parsed = parseProfile({ blockingChecks: ['minimum-test-rounds', 'no-signalling'], securityModel: 'collective' });
if (!parsed.ok) throw new Error(parsed.message);
const profile = parsed.profile;

const security = {
  checks: { significance: 0.001, count: 9, perCheck: 0.001 / 9, correction: 'Bonferroni: …' },
} as SecuritySummary;

const checks: CheckResult[] = [
  {
    id: 'stationarity-chsh',
    status: 'fail',
    observed: 0,
    log10PValue: -412.3,
    threshold: 0.001 / 9,
    message: 'The CHSH win fraction differs between the blocks (p = 5.0e-413).',
  },
  {
    id: 'minimum-test-rounds',
    status: 'pass',
    observed: 1200,
    log10PValue: null,
    threshold: 1000,
    message: '1200 CHSH test rounds and 1300 key-setting test rounds; both reach the minimum of 1000.',
  },
];

describe('RunChecks', () => {
  let fixture: ComponentFixture<RunChecks>;

  async function show(list: CheckResult[]): Promise<HTMLElement> {
    fixture = TestBed.createComponent(RunChecks);
    fixture.componentRef.setInput('checks', list);
    fixture.componentRef.setInput('security', security);
    fixture.componentRef.setInput('profile', profile);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const words = (element: Element | null | undefined) => element?.textContent?.replace(/\s+/g, ' ').trim();

  it('prints a p-value that underflowed from its log10, with the threshold as α/k', async () => {
    const host = await show(checks);
    const items = host.querySelectorAll('[data-testid="checks"] li');
    expect(words(items[0].querySelector('[data-testid="check-figures"]'))).toBe('p = 5.0e-413 · fails below α/k = 1e-3/9 = 1.1e-4');
    expect(words(items[0].querySelector('.bk-outcome'))).toBe('cancel Fail');
  });

  it('names each test by its label, its id only beside it, small', async () => {
    const host = await show(checks);
    const labels = Array.from(host.querySelectorAll('[data-testid="checks"] li .bk-check-label'));
    expect(labels.map(words)).toEqual(['Steady CHSH win fraction stationarity-chsh', 'Minimum test rounds minimum-test-rounds']);
    expect(labels[0].querySelector('code.bk-check-id')?.textContent).toBe('stationarity-chsh');
  });

  it('says which tests abort a run: the profile’s, stationarity under collective attacks, and the log’s integrity always', async () => {
    const host = await show(checks);
    expect(words(host.querySelector('[data-testid="aborting-tests"]'))).toBe(
      'Tests that abort a run: Log integrity, Minimum test rounds, No-signalling, Stationarity. A failure of any other test only warns.',
    );
  });

  it('gives a counting check its sentence alone', async () => {
    const host = await show(checks);
    const counting = host.querySelectorAll('[data-testid="checks"] li')[1];
    expect(counting.querySelector('[data-testid="check-figures"]')).toBeNull();
    expect(words(counting.querySelector('.bk-outcome'))).toBe('check_circle Pass');
  });

  it('says why there are no checks', async () => {
    const host = await show([]);
    expect(words(host)).toBe(
      'No checks ran: the run was INVALID before them, for the reasons under its verdict (a log that could not be read, or two station records out of step).',
    );
  });
});
