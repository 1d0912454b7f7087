import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { RunDto, SetupDto } from '@shared/api';
import { UNBOOKED_CAUTION } from '@shared/format/booking-words';
import { RunPage } from './run-page';

/** A run whose analysis stopped: finished, with no result to draw. */
const run = {
  id: 42,
  setupId: 2,
  setupName: 'Fen link',
  state: 'failed',
  progress: 0.4,
  verdict: null,
  error: 'The worker stopped.',
  result: null,
  file: { sha256: 'ab'.repeat(32), bytes: 1024, originalName: 'night-14.csv' },
  seed: '9f2c4e81a7d35b60c8e1f4a29b7d03e56a1c8f42e7b90d35c6a2f81e4b7d09c3',
  profileName: 'Nightly standard',
  profileVersion: 2,
  uploadedBy: 'Dev Okafor',
  createdAt: '2027-03-15T06:10:00Z',
  acquiredOn: null,
  notes: '',
  duplicateOf: null,
  replayOf: null,
  booking: null,
  signedOff: false,
  withdrawn: false,
  signOff: null,
  withdrawal: null,
  deliveries: [],
} as unknown as RunDto;

const setup = { id: 2, name: 'Fen link', shiftLeads: [] } as unknown as SetupDto;

describe('RunPage', () => {
  let http: HttpTestingController;
  let scrolledTo: string[];

  beforeEach(() => {
    scrolledTo = [];
    // jsdom lays nothing out and has no scrollIntoView: note which element was asked to show.
    Element.prototype.scrollIntoView = function (this: Element) {
      scrolledTo.push(this.id);
    };
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([{ path: 'runs/:id', component: RunPage }], withComponentInputBinding())],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function open(url: string, shown: RunDto = run): Promise<RouterTestingHarness> {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    // The run is asked for after a timer (it is polled until finished).
    await new Promise((resolve) => setTimeout(resolve, 0));
    http.expectOne('/api/runs/42').flush(shown);
    await harness.fixture.whenStable();
    http.expectOne('/api/setups/2').flush(setup);
    http.expectOne('/api/runs/42/trail').flush([]);
    await harness.fixture.whenStable();
    return harness;
  }

  it('shows the sign-off when the address ends in #sign-off, as the verdict mail’s link does', async () => {
    const harness = await open('/runs/42#sign-off');
    expect(harness.routeNativeElement?.querySelector('#sign-off h2')?.textContent).toBe('Sign-off');
    expect(scrolledTo).toEqual(['sign-off']);
  });

  it('stays at the top otherwise, and shows how the run came to its seed', async () => {
    const harness = await open('/runs/42');
    expect(scrolledTo).toEqual([]);
    expect(harness.routeNativeElement?.querySelector('[data-testid="run-booking"]')?.textContent).toContain(UNBOOKED_CAUTION);
  });

  it('names both station logs of a pair in its header, and shows the pair’s panel', async () => {
    const pair = {
      ...run,
      stations: {
        stationB: { sha256: 'cd'.repeat(32), bytes: 2048, originalName: 'mill-lane-14.csv' },
        offset: null,
        offsetReason: null,
        realignedFrom: null,
        geometry: null,
      },
    } as RunDto;
    const harness = await open('/runs/42', pair);
    const page = harness.routeNativeElement!;
    expect(page.querySelector('.bk-page-header p')?.textContent.replace(/\s+/g, ' ')).toContain('night-14.csv and mill-lane-14.csv (two station logs),');
    expect(page.querySelector('[data-testid="station-pair"] h2')?.textContent).toBe('Two station logs');
    expect(page.querySelector('[data-testid="provenance"]')?.textContent).toContain('Station B’s SHA-256');
  });

  it('shows no station panel for one joined log', async () => {
    const harness = await open('/runs/42', { ...run, stations: null });
    expect(harness.routeNativeElement!.querySelector('[data-testid="station-pair"]')).toBeNull();
  });
});
