import { Location } from '@angular/common';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';

import type { Role, RunPageDto, RunSummaryDto } from '@shared/api';
import { RunList } from './run-list';
import { signInAs } from '../../testing/sign-in-as';
import { settle } from '../../testing/settle';

const night: RunSummaryDto = {
  id: 31,
  setupId: 2,
  setupName: 'Heron Reach link',
  profileVersionId: 4,
  profileName: 'Nightly standard',
  profileVersion: 1,
  state: 'accepted',
  progress: 1,
  verdict: 'ACCEPT',
  winFraction: 0.8461,
  winThreshold: 0.8236,
  qber: 0.0213,
  chshValue: 2.77,
  finiteKeyBits: 41_250,
  uploadedBy: 'Dev Okafor',
  acquiredOn: '2026-11-29',
  createdAt: '2026-11-30T06:10:00Z',
  finishedAt: '2026-11-30T06:11:00Z',
  duplicateOf: null,
  bookingId: null,
  attempt: null,
  replayOf: null,
  signedOff: false,
  stationPair: false,
  withdrawn: false,
  fileSha256: '5be0c1'.padEnd(64, '0'),
  fingerprint: '77aa01'.padEnd(64, '1'),
};

const pageOf = (items: RunSummaryDto[], total = items.length): RunPageDto => ({ items, total, page: 0, pageSize: 25 });

describe('RunList', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<RunList>;
  let host: HTMLElement;

  const runRequests = (): TestRequest[] => http.match((request) => request.url === '/api/runs');
  const text = () => host.textContent.replace(/\s+/g, ' ');

  /** Signs in with `roles` and opens the list; its setups (and for an admin, users) answered empty. */
  async function openAs(roles: Role[]): Promise<void> {
    signInAs(roles);
    fixture = TestBed.createComponent(RunList);
    host = fixture.nativeElement as HTMLElement;
    await settle(fixture);
    http.expectOne('/api/setups').flush([]);
    if (roles.includes('admin')) http.expectOne('/api/users').flush([]);
  }

  beforeAll(() => {
    // jsdom has no canvas: the win-fraction bars then draw nothing.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  beforeEach(() => {
    jest.useFakeTimers();
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('asks for the newest uploads first and shows each run with its verdict and figures; a row opens its run', async () => {
    await openAs(['experimentalist']);
    const [first] = runRequests();
    expect(['page', 'pageSize', 'sort', 'direction'].map((name) => first.request.params.get(name))).toEqual(['0', '25', 'createdAt', 'desc']);
    first.flush(pageOf([night]));
    await settle(fixture);

    const row = host.querySelector<HTMLElement>('[data-testid="run-row-31"]')!;
    expect(row.textContent).toContain('#31');
    expect(row.textContent).toContain('Heron Reach link');
    expect(row.textContent).toContain('ACCEPT');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    row.click();
    expect(navigate).toHaveBeenCalledWith(['/runs', 31]);
  });

  it('asks again from the first page with a filter, and says when no run matches, with a way back', async () => {
    // A British browser types the day first: 01/12/2026 is the first of December.
    const language = jest.spyOn(navigator, 'language', 'get').mockReturnValue('en-GB');
    await openAs(['experimentalist']);
    runRequests()[0].flush(pageOf([night], 60));
    await settle(fixture);
    expect(text()).toContain('e.g. 31/12/2026');

    const from = host.querySelector<HTMLInputElement>('input[aria-label="Uploaded from"]')!;
    from.value = '01/12/2026';
    from.dispatchEvent(new Event('input'));
    await settle(fixture, 300);
    const [filtered] = runRequests();
    expect(filtered.request.params.get('from')).toBe('2026-12-01');
    expect(filtered.request.params.get('page')).toBe('0');
    filtered.flush(pageOf([]));
    await settle(fixture);
    expect(host.querySelector('[data-testid="runs-empty"]')!.textContent).toContain('No run matches these filters.');

    Array.from(host.querySelectorAll<HTMLButtonElement>('[data-testid="runs-empty"] button'))
      .find((button) => button.textContent.includes('Clear filters'))!
      .click();
    await settle(fixture, 300);
    const [cleared] = runRequests();
    expect(cleared.request.params.has('from')).toBe(false);
    cleared.flush(pageOf([night]));
    await settle(fixture);
    expect(host.querySelector('[data-testid="run-row-31"]')).not.toBeNull();
    language.mockRestore();
  });

  it('tells an experimentalist with no runs yet to upload the first night, and someone else who does', async () => {
    await openAs(['experimentalist']);
    runRequests()[0].flush(pageOf([]));
    await settle(fixture);
    expect(text()).toContain("Upload the first night's log to get a verdict.");

    TestBed.resetTestingModule();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    await openAs(['auditor']);
    runRequests()[0].flush(pageOf([]));
    await settle(fixture);
    expect(text()).toContain('Experimentalists upload the nightly logs');
  });

  it('says when the runs cannot be loaded, and tries again on request', async () => {
    await openAs(['shift-lead']);
    runRequests()[0].flush({ error: { code: 'unavailable', message: 'The database does not answer.' } }, { status: 503, statusText: 'Service Unavailable' });
    await settle(fixture);
    expect(host.querySelector('[role="alert"]')!.textContent).toContain('The runs could not be loaded.');

    Array.from(host.querySelectorAll<HTMLButtonElement>('[role="alert"] button'))
      .find((button) => button.textContent.includes('Try again'))!
      .click();
    await settle(fixture);
    runRequests()[0].flush(pageOf([night]));
    await settle(fixture);
    expect(host.querySelector('[data-testid="run-row-31"]')).not.toBeNull();
  });

  it('opens with the filters, page and sort of the address, and writes each change back to it (a reload or a shared link keeps the list)', async () => {
    const router = TestBed.inject(Router);
    await router.navigateByUrl('/?setupId=2&awaitingSignOff=true&from=2026-12-01&page=2&sort=acquiredOn&direction=asc&verdict=ACCEPT');
    await openAs(['experimentalist']);
    const [first] = runRequests();
    const asked = Object.fromEntries(first.request.params.keys().map((key) => [key, first.request.params.get(key)]));
    expect(asked).toEqual({ page: '2', pageSize: '25', sort: 'acquiredOn', direction: 'asc', setupId: '2', verdict: 'ACCEPT', awaitingSignOff: 'true', from: '2026-12-01' });
    first.flush(pageOf([night], 80));
    await settle(fixture);

    // Another verdict: back to the first page, and the address says so.
    fixture.componentInstance['filters'].controls.verdict.setValue('ABORT');
    await settle(fixture, 300);
    runRequests()[0].flush(pageOf([]));
    await settle(fixture);
    const address = new URL(TestBed.inject(Location).path(), 'http://bellkeep.invalid').searchParams;
    expect(Object.fromEntries(address.entries())).toEqual({ setupId: '2', awaitingSignOff: 'true', from: '2026-12-01', sort: 'acquiredOn', direction: 'asc', verdict: 'ABORT' });
  });
});
