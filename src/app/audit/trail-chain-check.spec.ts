import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';

import type { TrailCheckDto } from '@shared/api';
import { TrailChainCheck } from './trail-chain-check';

const intact: TrailCheckDto = {
  intact: true,
  events: 1204,
  head: { seq: 1204, hash: '3f2a9c0d1e7b'.padEnd(64, '0') },
  checkedAt: '2027-03-02T09:15:00Z',
  problems: [],
  problemCount: 0,
};

const broken: TrailCheckDto = {
  ...intact,
  intact: false,
  events: 1203,
  problems: [
    'Link 57 records event 61, which is no longer in the trail: the event’s row was removed.',
    'Event 88 no longer hashes to link 84: a field of the event was changed after it was recorded.',
  ],
  problemCount: 5,
};

describe('TrailChainCheck', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<TrailChainCheck>;
  let host: HTMLElement;

  /** An element's text with its white space (thin spaces of counts included) as single spaces. */
  const text = (testId: string) => host.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim();

  async function checkAndAnswer(answer: TrailCheckDto): Promise<void> {
    host.querySelector<HTMLButtonElement>('[data-testid="check-trail-chain"]')!.click();
    await fixture.whenStable();
    expect(host.querySelector('[role="status"]')?.textContent).toContain('Recomputing every link of the trail');
    http.expectOne('/api/audit/trail-check').flush(answer);
    await fixture.whenStable();
  }

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(TrailChainCheck);
    host = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  it('checks only when asked', () => {
    http.expectNone('/api/audit/trail-check');
    expect(host.querySelector('button')?.textContent).toContain('Check the trail’s chain');
    expect(host.querySelector('[data-testid="trail-chain-outcome"]')).toBeNull();
  });

  it('says Intact with the count of events and the newest link', async () => {
    await checkAndAnswer(intact);
    expect(text('trail-chain-outcome')).toMatch(
      /^verified ?Intact: all 1 204 events are linked in order up to link 1 204 \(3f2a9c0d1e7b…\) \(checked Mar 2, 2027, \d\d:15:00 [AP]M (UTC|GMT[+-]\d+(:\d\d)?)\)\.$/,
    );
    expect(host.querySelector('[data-testid="trail-chain-problems"]')).toBeNull();
  });

  it('lists each problem in a sentence, and says how many more were found than listed', async () => {
    await checkAndAnswer(broken);
    expect(text('trail-chain-outcome')).toMatch(/^gpp_bad ?Broken: 5 problems in a trail of 1 203 events \(checked/);
    expect(Array.from(host.querySelectorAll('[data-testid="trail-chain-problems"] li'), (item) => item.textContent)).toEqual(broken.problems);
    expect(text('trail-chain-unlisted')).toBe('3 more problems are not listed here.');
  });

  it('gives the server’s sentence when the check cannot be made', async () => {
    host.querySelector<HTMLButtonElement>('[data-testid="check-trail-chain"]')!.click();
    await fixture.whenStable();
    http.expectOne('/api/audit/trail-check').flush({ error: { code: 'forbidden', message: 'This needs the auditor or admin role.' } }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(host.querySelector('[role="alert"]')?.textContent).toContain('The chain could not be checked. This needs the auditor or admin role.');
  });
});
