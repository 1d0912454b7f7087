import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { RunPageDto, RunSummaryDto } from '@shared/api';
import { FinishedRuns } from './finished-runs';
import { settle } from '../../testing/settle';

const night: RunSummaryDto = {
  id: 12,
  setupId: 1,
  setupName: 'Mill Lane link',
  profileVersionId: 3,
  profileName: 'Night standard',
  profileVersion: 2,
  state: 'aborted',
  progress: 1,
  verdict: 'ABORT',
  winFraction: 0.7987,
  winThreshold: 0.8236,
  qber: 0.061,
  chshValue: 2.39,
  finiteKeyBits: 0,
  uploadedBy: 'Ada Marsh',
  acquiredOn: '2026-11-18',
  createdAt: '2026-11-19T05:30:00Z',
  finishedAt: '2026-11-19T05:42:00Z',
  duplicateOf: null,
  bookingId: 3,
  attempt: 1,
  replayOf: null,
  signedOff: true,
  stationPair: false,
  withdrawn: false,
  fileSha256: '9f3ac07e1b22d4f9a0e6'.padEnd(64, '0'),
  fingerprint: '41d2be7765aa90f3be21'.padEnd(64, '5'),
};

const pageOf = (items: RunSummaryDto[]): RunPageDto => ({ items, total: items.length, page: 0, pageSize: 25 });

describe('FinishedRuns', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<FinishedRuns>;
  let host: HTMLElement;

  const runRequests = (): TestRequest[] => http.match((request) => request.url === '/api/runs');

  async function type(field: string, value: string): Promise<void> {
    const input = host.querySelector<HTMLInputElement>(`input[formcontrolname="${field}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    // Past the pause the list waits for while someone types.
    await settle(fixture, 400);
  }

  beforeEach(async () => {
    jest.useFakeTimers();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(FinishedRuns);
    host = fixture.nativeElement as HTMLElement;
    await settle(fixture);
    http.expectOne('/api/setups').flush([]);
    http.expectOne('/api/profiles').flush([]);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('asks for finished runs only and shows each with its shortened hashes, the full ones in the title', async () => {
    const [first] = runRequests();
    expect(first.request.params.get('finished')).toBe('true');
    expect(first.request.params.get('page')).toBe('0');
    first.flush(pageOf([night]));
    await settle(fixture);

    const row = host.querySelector('[data-testid="audit-run-row-12"]')!;
    const hashes = Array.from(row.querySelectorAll('code'), (code) => ({ shown: code.textContent?.trim(), title: code.getAttribute('title') }));
    expect(hashes).toEqual([
      { shown: '9f3ac07e1b22…', title: night.fileSha256 },
      { shown: '41d2be7765aa…', title: night.fingerprint },
    ]);
    expect(row.textContent).toContain('Night standard v2');
    expect(row.querySelector('[data-testid="verdict-chip"]')?.textContent).toContain('ABORT');
  });

  it('says under each night how its run was booked: nothing for a first log, the attempt of a replacement, "unbooked"', async () => {
    runRequests()[0].flush(pageOf([night, { ...night, id: 13, attempt: 2 }, { ...night, id: 14, bookingId: null, attempt: null }]));
    await settle(fixture);
    const noteOf = (id: number) => host.querySelector(`[data-testid="booking-note-${id}"]`)?.textContent?.trim() ?? null;
    expect([noteOf(12), noteOf(13), noteOf(14)]).toEqual([null, 'attempt 2', 'unbooked']);
  });

  it('says what is wrong with a hash prefix and keeps the list until it is right', async () => {
    runRequests()[0].flush(pageOf([night]));
    await settle(fixture);

    await type('sha256', '9f3');
    expect(host.querySelector('mat-error')?.textContent?.trim()).toBe('Give at least 4 hexadecimal digits.');
    expect(runRequests()).toHaveLength(0);

    await type('sha256', '9f3g');
    expect(host.querySelector('mat-error')?.textContent?.trim()).toBe('Use only the digits 0–9 and the letters a–f.');
    expect(runRequests()).toHaveLength(0);

    await type('sha256', ' 9F3A ');
    expect(host.querySelector('mat-error')).toBeNull();
    const [search] = runRequests();
    expect(search.request.params.get('sha256')).toBe('9f3a');
    expect(search.request.params.get('finished')).toBe('true');
    search.flush(pageOf([night]));
    await settle(fixture);
    expect(host.querySelector('[data-testid="audit-run-row-12"]')).not.toBeNull();
  });
});
