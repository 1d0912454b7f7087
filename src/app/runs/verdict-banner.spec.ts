import { ComponentFixture, TestBed } from '@angular/core/testing';

import type { AnalysisResult } from '@shared/analysis';
import type { RunDto } from '@shared/api';
import { VerdictBanner } from './verdict-banner';

/** A run with only what the banner reads, its result too. */
function runWith(changes: Omit<Partial<RunDto>, 'result'> & { result?: Partial<AnalysisResult> | null }): RunDto {
  return { id: 7, state: 'queued', progress: 0, error: null, result: null, ...changes } as RunDto;
}

describe('VerdictBanner', () => {
  let fixture: ComponentFixture<VerdictBanner>;

  async function show(run: RunDto): Promise<HTMLElement> {
    fixture = TestBed.createComponent(VerdictBanner);
    fixture.componentRef.setInput('run', run);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const text = (host: HTMLElement, testId: string) => host.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim();

  /** An accepted run whose collective key has `bits`. */
  const acceptedWith = (bits: number) =>
    runWith({
      state: 'accepted',
      verdict: 'ACCEPT',
      result: {
        verdict: 'ACCEPT',
        reasons: [],
        errors: [],
        errorCount: 0,
        key: { finiteKeyBits: bits, generalAttackBits: null } as AnalysisResult['key'],
        security: { model: 'collective' } as AnalysisResult['security'],
      },
    });

  it('says ACCEPT with its icon and no reasons', async () => {
    const host = await show(acceptedWith(41_250));
    expect(text(host, 'verdict-word')).toBe('ACCEPT');
    expect(host.querySelector('.bk-banner-headline')?.textContent).toBe(
      'Every acceptance criterion holds and no test that aborts a run failed: the raw key of this run may be kept.',
    );
    expect(host.querySelector('.bk-banner-icon')?.textContent).toBe('verified');
    expect(host.querySelector('section')?.classList).toContain('bk-banner-accept');
    expect(host.querySelector('[data-testid="verdict-reasons"]')).toBeNull();
  });

  it('says of an ACCEPT with no key at this size that none is kept', async () => {
    const host = await show(acceptedWith(0));
    expect(text(host, 'verdict-word')).toBe('ACCEPT');
    expect(host.querySelector('.bk-banner-headline')?.textContent).toContain('but no key can be extracted from a run of this size: none is kept.');
  });

  it('says ABORT and lists every reason', async () => {
    const reasons = ['The CHSH win fraction 0.798711 is below the threshold 0.823553 (ω_Q − 0.03).', 'The error rate on the key setting 0.061000 is above the tolerance 0.05.'];
    const host = await show(runWith({ state: 'aborted', verdict: 'ABORT', result: { verdict: 'ABORT', reasons, errors: [], errorCount: 0 } }));
    expect(text(host, 'verdict-word')).toBe('ABORT');
    expect(host.querySelector('.bk-banner-icon')?.textContent).toBe('block');
    expect(Array.from(host.querySelectorAll('[data-testid="verdict-reasons"] li'), (item) => item.textContent?.trim())).toEqual(reasons);
  });

  it('says INVALID and lists the first problems of the log with how many more there are', async () => {
    const errors = Array.from({ length: 6 }, (_, i) => ({
      line: 6 + i,
      column: i === 0 ? null : 'x',
      value: i === 0 ? null : '7',
      message: i === 0 ? 'the row has 4 fields, the header has 5' : 'the station A setting must be 0 or 1',
    }));
    const host = await show(runWith({ state: 'invalid', verdict: 'INVALID', result: { verdict: 'INVALID', reasons: ['The log has 8 problems.'], errors, errorCount: 8 } }));
    expect(text(host, 'verdict-word')).toBe('INVALID');
    const problems = Array.from(host.querySelectorAll('[data-testid="log-problems"] li'), (item) => item.textContent?.replace(/\s+/g, ' ').trim());
    expect(problems).toHaveLength(5);
    expect(problems[0]).toBe('Line 6: the row has 4 fields, the header has 5');
    expect(problems[1]).toBe('Line 7, column x, value 7: the station A setting must be 0 or 1');
    expect(host.textContent).toContain('and 3 more problems');
  });

  it('shows the analysis progress while the run is being analysed', async () => {
    const host = await show(runWith({ state: 'analysing', progress: 0.42 }));
    expect(text(host, 'verdict-word')).toBe('Analysing');
    expect(host.querySelector('mat-progress-bar')?.getAttribute('aria-valuenow')).toBe('42');
    expect(host.textContent).toContain('42 % of the log read');
  });

  it('gives the error of an analysis that stopped', async () => {
    const host = await show(runWith({ state: 'failed', error: 'The archived log is missing.' }));
    expect(text(host, 'verdict-word')).toBe('Analysis failed');
    expect(text(host, 'run-error')).toBe('The archived log is missing.');
    expect(host.querySelector('mat-progress-bar')).toBeNull();
  });
});
