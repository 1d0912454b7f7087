import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';

import type { ReverificationDto, Role } from '@shared/api';
import { RunReverifications } from './run-reverifications';
import { signInAs } from '../../testing/sign-in-as';

const LIST = '/api/runs/12/reverifications';

const reproduced: ReverificationDto = {
  id: 3,
  runId: 12,
  requestedBy: 'Sami Virtanen',
  seed: null,
  state: 'reproduced',
  storedFingerprint: 'c07e1b22d4f9a0e6'.repeat(4),
  storedEngineVersion: '1.2.0',
  newFingerprint: 'c07e1b22d4f9a0e6'.repeat(4),
  newEngineVersion: '1.2.0',
  differences: [],
  differenceCount: 0,
  error: null,
  createdAt: '2027-02-10T10:00:00Z',
  finishedAt: '2027-02-10T10:03:00Z',
};

const differs: ReverificationDto = {
  ...reproduced,
  id: 4,
  state: 'differs',
  newFingerprint: '77aa90f3be215c4d'.repeat(4),
  newEngineVersion: '1.3.0',
  differences: [
    { path: 'chsh.winFraction', stored: 0.8412, recomputed: 0.8409 },
    { path: 'engineVersion', stored: '1.2.0', recomputed: '1.3.0' },
  ],
  differenceCount: 5,
  createdAt: '2027-03-01T10:00:00Z',
  finishedAt: '2027-03-01T10:04:00Z',
};

describe('RunReverifications', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<RunReverifications>;

  /** Change detection (which starts the signals' effects), then whatever they scheduled at once. */
  async function settle(): Promise<void> {
    fixture.detectChanges();
    await jest.advanceTimersByTimeAsync(0);
    fixture.detectChanges();
  }

  async function showAs(roles: Role[]): Promise<HTMLElement> {
    signInAs(roles, { id: 5, name: 'Sami Virtanen', email: 'sami.virtanen@kestrelfen.example' });
    fixture = TestBed.createComponent(RunReverifications);
    fixture.componentRef.setInput('runId', 12);
    await settle();
    return fixture.nativeElement as HTMLElement;
  }

  /** The state as shown: its icon and, beside it, its word. */
  function stateOf(host: HTMLElement, id: number): { icon: string; word: string } {
    const state = host.querySelector(`[data-testid="reverification-state-${id}"]`)!;
    const icon = state.querySelector('mat-icon')?.textContent?.trim() ?? '';
    return { icon, word: state.textContent.replace(icon, '').trim() };
  }
  const reverifyButton = (host: HTMLElement) => host.querySelector<HTMLButtonElement>('[data-testid="reverify"]');

  beforeEach(() => {
    jest.useFakeTimers();
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('lists each re-verification with its state in words and the fields that differ', async () => {
    const host = await showAs(['shift-lead']);
    http.expectOne(LIST).flush([differs, reproduced]);
    await settle();

    expect(stateOf(host, 4)).toEqual({ icon: 'difference', word: 'Differs' });
    expect(stateOf(host, 3)).toEqual({ icon: 'task_alt', word: 'Reproduced' });
    const differing = host.querySelector('[data-testid="reverification-4"]')!;
    expect(differing.textContent).toContain('stored with 1.2.0 · recomputed with 1.3.0');
    const rows = Array.from(differing.querySelectorAll('tbody tr'), (row) => Array.from(row.children, (cell) => cell.textContent?.trim()));
    expect(rows).toEqual([
      ['chsh.winFraction', '0.8412', '0.8409'],
      ['engineVersion', '1.2.0', '1.3.0'],
    ]);
    expect(differing.textContent).toContain('The first 2 of 5 differing fields.');
    // Same engine both times: no engine line for the reproduced one.
    expect(host.querySelector('[data-testid="reverification-3"]')?.textContent).not.toContain('recomputed with');
    expect(reverifyButton(host)).toBeNull();
    await jest.advanceTimersByTimeAsync(3000);
    http.expectNone(LIST);
  });

  it('lets an auditor ask for a re-analysis and follows it until it settles', async () => {
    const host = await showAs(['auditor']);
    http.expectOne(LIST).flush([reproduced]);
    await settle();
    expect(reverifyButton(host)?.disabled).toBe(false);

    reverifyButton(host)!.click();
    const request = http.expectOne({ method: 'POST', url: LIST });
    const queued: ReverificationDto = { ...reproduced, id: 5, state: 'queued', newFingerprint: null, newEngineVersion: null, finishedAt: null, createdAt: '2027-03-02T09:00:00Z' };
    request.flush(queued, { status: 201, statusText: 'Created' });
    await settle();

    http.expectOne({ method: 'GET', url: LIST }).flush([queued, reproduced]);
    await settle();
    expect(stateOf(host, 5)).toEqual({ icon: 'schedule', word: 'Queued' });
    expect(reverifyButton(host)?.disabled).toBe(true);

    await jest.advanceTimersByTimeAsync(1000);
    http.expectOne(LIST).flush([{ ...queued, state: 'analysing' }, reproduced]);
    await settle();
    expect(stateOf(host, 5)).toEqual({ icon: 'hourglass_top', word: 'Analysing' });

    await jest.advanceTimersByTimeAsync(1000);
    http
      .expectOne(LIST)
      .flush([{ ...queued, state: 'reproduced', newFingerprint: reproduced.storedFingerprint, newEngineVersion: '1.2.0', finishedAt: '2027-03-02T09:03:00Z' }, reproduced]);
    await settle();
    expect(stateOf(host, 5)).toEqual({ icon: 'task_alt', word: 'Reproduced' });
    expect(reverifyButton(host)?.disabled).toBe(false);

    await jest.advanceTimersByTimeAsync(3000);
    http.expectNone(LIST);
  });

  it('shows the server’s sentence when the request is refused', async () => {
    const host = await showAs(['admin']);
    http.expectOne(LIST).flush([]);
    await settle();
    expect(host.querySelector('[data-testid="no-reverifications"]')?.textContent?.trim()).toBe('No re-verification yet.');

    reverifyButton(host)!.click();
    http
      .expectOne({ method: 'POST', url: LIST })
      .flush({ error: { code: 'conflict', message: 'A re-verification of run 12 is already under way.' } }, { status: 409, statusText: 'Conflict' });
    await settle();
    expect(host.querySelector('[role="alert"]')?.textContent).toContain('A re-verification of run 12 is already under way.');
  });

  it('lets an admin re-analyse with a seed drawn in the browser, and says such a row never replaces the verdict', async () => {
    const host = await showAs(['admin']);
    http.expectOne(LIST).flush([reproduced]);
    await settle();
    host.querySelector<HTMLButtonElement>('[data-testid="open-seed-form"]')!.click();
    await settle();

    host.querySelector<HTMLButtonElement>('[data-testid="draw-seed"]')!.click();
    await settle();
    const drawn = host.querySelector<HTMLInputElement>('[data-testid="seed-input"]')!.value;
    expect(drawn).toMatch(/^[0-9a-f]{64}$/);

    host.querySelector<HTMLButtonElement>('[data-testid="reverify-with-seed"]')!.click();
    const request = http.expectOne({ method: 'POST', url: LIST });
    expect(request.request.body).toEqual({ seed: drawn });
    const seeded: ReverificationDto = { ...differs, id: 6, seed: drawn, state: 'differs', createdAt: '2027-03-03T10:00:00Z' };
    request.flush(seeded, { status: 201, statusText: 'Created' });
    await settle();
    http.expectOne({ method: 'GET', url: LIST }).flush([seeded, reproduced]);
    await settle();

    expect(host.querySelector('[data-testid="seed-form"]')).toBeNull();
    const seedRow = host.querySelector('[data-testid="reverification-seed-6"]')!;
    expect(seedRow.querySelector('code')?.getAttribute('title')).toBe(drawn);
    expect(seedRow.textContent).toContain('another seed — never replaces the verdict');
    expect(host.querySelector('[data-testid="reverification-seed-3"]')).toBeNull();
  });

  it('asks for 64 hex digits before sending a typed seed', async () => {
    const host = await showAs(['admin']);
    http.expectOne(LIST).flush([]);
    await settle();
    host.querySelector<HTMLButtonElement>('[data-testid="open-seed-form"]')!.click();
    await settle();
    const input = host.querySelector<HTMLInputElement>('[data-testid="seed-input"]')!;
    input.value = '9f2c4e81';
    input.dispatchEvent(new Event('input'));
    host.querySelector<HTMLButtonElement>('[data-testid="reverify-with-seed"]')!.click();
    await settle();
    http.expectNone({ method: 'POST', url: LIST });
    expect(host.querySelector('[data-testid="seed-form"]')?.textContent).toContain('A seed is 64 hexadecimal digits');
  });

  it('offers another seed to admins only', async () => {
    const host = await showAs(['auditor']);
    http.expectOne(LIST).flush([]);
    await settle();
    expect(host.querySelector('[data-testid="reverify"]')).not.toBeNull();
    expect(host.querySelector('[data-testid="open-seed-form"]')).toBeNull();
  });
});
