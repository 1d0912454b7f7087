import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';

import type { RunDto, SetupDto } from '@shared/api';
import { settle } from '../../testing/settle';
import { signInAs, type SpecPerson } from '../../testing/sign-in-as';
import { RealignForm } from './realign-form';

const LUCIA: SpecPerson = { id: 3, name: 'Lucia Brandt', email: 'lucia.brandt@kestrelfen.example' };
const DEV: SpecPerson = { id: 9, name: 'Dev Okafor', email: 'dev.okafor@kestrelfen.example' };
const FEN_LINK = { id: 2, name: 'Fen link', shiftLeads: [LUCIA] } as unknown as SetupDto;

/** Run 43: two station logs found shifted, station B's record 3 rounds behind. */
const SHIFTED = {
  id: 43,
  setupId: 2,
  state: 'invalid',
  verdict: 'INVALID',
  stations: { offset: null, offsetReason: null, realignedFrom: null, geometry: null, stationB: {} },
  result: { stations: { alignment: { shifted: true, bestOffset: -3 } } },
} as unknown as RunDto;

describe('RealignForm', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<RealignForm>;
  let host: HTMLElement;

  async function open(person: SpecPerson, run: RunDto = SHIFTED): Promise<void> {
    signInAs(['shift-lead'], person);
    fixture = TestBed.createComponent(RealignForm);
    fixture.componentRef.setInput('run', run);
    fixture.componentRef.setInput('setup', FEN_LINK);
    host = fixture.nativeElement as HTMLElement;
    await settle(fixture);
  }

  const field = (testId: string) => host.querySelector<HTMLInputElement & HTMLTextAreaElement>(`[data-testid="${testId}"]`)!;
  const type = (testId: string, value: string) => {
    field(testId).value = value;
    field(testId).dispatchEvent(new Event('input'));
  };
  const submit = async () => {
    host.querySelector<HTMLButtonElement>('[data-testid="realign-button"]')!.click();
    await settle(fixture);
  };

  beforeEach(() => {
    jest.useFakeTimers();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('starts a shift lead from the offset the check named, asks for a reason, re-runs and opens the new run', async () => {
    await open(LUCIA);
    expect(field('realign-offset').value).toBe('-3');
    await submit();
    expect(host.textContent).toContain('Say why the records are paired at this offset.');

    type('realign-reason', '  Station B’s buffer dropped its first three triggers at start-up (ticket 2207).  ');
    await submit();
    const request = http.expectOne({ method: 'POST', url: '/api/runs/43/realign' });
    expect(request.request.body).toEqual({ offset: -3, reason: 'Station B’s buffer dropped its first three triggers at start-up (ticket 2207).' });
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    request.flush({ id: 44 });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/runs', 44]);
  });

  it('refuses the offset the run already pairs at, and one beyond ±16', async () => {
    await open(LUCIA, { ...SHIFTED, stations: { ...SHIFTED.stations!, offset: -3 } });
    type('realign-reason', 'Checked again.');
    await submit();
    expect(host.textContent).toContain('The run already pairs the records at −3: state another offset.');
    type('realign-offset', '17');
    await submit();
    expect(host.textContent).toContain('Give a whole number of rounds from −16 to 16.');
  });

  it('shows the server’s refusal', async () => {
    await open(LUCIA);
    type('realign-reason', 'Shift found by the check.');
    await submit();
    http
      .expectOne('/api/runs/43/realign')
      .flush(
        { error: { code: 'forbidden', message: 'Only a shift lead assigned to this run’s setup can re-run its station logs at a stated offset.' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await settle(fixture);
    expect(host.querySelector('[role="alert"]')?.textContent).toContain('Only a shift lead assigned to this run’s setup');
  });

  it('tells someone who leads no part of the setup who may re-run it', async () => {
    await open(DEV);
    expect(host.querySelector('[data-testid="realign-form"]')).toBeNull();
    expect(host.querySelector('[data-testid="realign-who"]')?.textContent).toContain('A shift lead of this setup (Lucia Brandt) can re-run the night at a stated offset');
  });
});
