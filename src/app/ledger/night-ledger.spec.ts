import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { LedgerDto } from '@shared/api';
import { settle } from '../../testing/settle';
import { lookOfCell } from './ledger-cell';
import { NightLedger } from './night-ledger';

/** Two setups of the invented lab: the Fen link with a replaced, signed night and a booked night without a log; the bench with an ABORT awaiting sign-off. */
const LEDGER: LedgerDto = {
  from: '2026-11-15',
  to: '2026-12-05',
  setups: [
    {
      setupId: 1,
      name: 'Fen link',
      cells: [
        {
          night: '2026-12-01',
          bookingId: 7,
          attempts: 2,
          run: { id: 31, state: 'accepted', verdict: 'ACCEPT', signedOff: true, decision: 'key-kept', withdrawn: false },
          waitingFor: null,
        },
        { night: '2026-12-05', bookingId: 9, attempts: 0, run: null, waitingFor: null },
      ],
    },
    {
      setupId: 2,
      name: 'Mill Lane bench',
      cells: [
        {
          night: '2026-12-02',
          bookingId: null,
          attempts: 1,
          run: { id: 33, state: 'aborted', verdict: 'ABORT', signedOff: false, decision: null, withdrawn: false },
          waitingFor: null,
        },
      ],
    },
  ],
};

describe('NightLedger', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<NightLedger>;
  let host: HTMLElement;

  /** The cells of a setup's row, as label and link, by night. */
  const row = (name: string) =>
    Array.from(host.querySelectorAll('tbody tr'))
      .find((tr) => tr.querySelector('th')!.textContent.trim() === name)!
      .querySelectorAll('td');

  beforeEach(async () => {
    jest.useFakeTimers({ now: Date.parse('2026-12-05T09:00:00Z') });
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(NightLedger);
    host = fixture.nativeElement as HTMLElement;
    await settle(fixture);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('asks for the last three weeks and puts each night under its column, by shape and word, with what it opens', async () => {
    const asked = http.expectOne((request) => request.url === '/api/ledger');
    expect([asked.request.params.get('from'), asked.request.params.get('to')]).toEqual(['2026-11-15', '2026-12-05']);
    asked.flush(LEDGER);
    await settle(fixture);

    expect(host.querySelectorAll('thead th')).toHaveLength(22);
    const fen = row('Fen link');
    expect(fen).toHaveLength(21);
    // 1 December is the 17th night shown, 5 December the last.
    const replaced = fen[16].querySelector('a')!;
    expect(replaced.getAttribute('aria-label')).toBe('Fen link, night of Dec 1, 2026: ACCEPT, 2 logs, kept (signed off: key kept)');
    expect(replaced.getAttribute('href')).toBe('/runs/31');
    expect(replaced.textContent).toContain('kept');
    const booked = fen[20].querySelector('a')!;
    expect(booked.getAttribute('aria-label')).toBe('Fen link, night of Dec 5, 2026: Booked, no log yet');
    expect(booked.getAttribute('href')).toBe('/setups/1');
    expect(fen[0].textContent.trim()).toBe('');

    const bench = row('Mill Lane bench')[17].querySelector('a')!;
    expect(bench.getAttribute('aria-label')).toBe('Mill Lane bench, night of Dec 2, 2026: ABORT, to sign (awaiting sign-off), unbooked');
    expect(bench.textContent).toContain('to sign');
  });

  it('goes a week back and forth, never past tonight', async () => {
    http.expectOne((request) => request.url === '/api/ledger').flush(LEDGER);
    await settle(fixture);
    const [earlier, later] = Array.from(host.querySelectorAll<HTMLButtonElement>('header button'));
    expect(later.disabled).toBe(true);
    earlier.click();
    await settle(fixture);
    const asked = http.expectOne((request) => request.url === '/api/ledger');
    expect([asked.request.params.get('from'), asked.request.params.get('to')]).toEqual(['2026-11-08', '2026-11-28']);
  });
});

describe('lookOfCell', () => {
  it('shows a withdrawn log as withdrawn, with the verdict it had, and says so in full', () => {
    const look = lookOfCell(
      {
        night: '2026-12-03',
        bookingId: null,
        attempts: 2,
        run: { id: 40, state: 'aborted', verdict: 'ABORT', signedOff: false, decision: null, withdrawn: true },
        waitingFor: null,
      },
      'Fen link',
    );
    expect(look).toEqual({
      icon: 'undo',
      word: 'Withdrawn',
      tone: 'pending',
      note: '2 logs · ABORT',
      label: 'Fen link, night of Dec 3, 2026: Withdrawn, 2 logs, ABORT (the log was withdrawn as a mistaken upload)',
      runId: 40,
    });
  });

  it('shows a night with one station log in as waiting for the other station', () => {
    const look = lookOfCell({ night: '2026-12-04', bookingId: 9, attempts: 0, run: null, waitingFor: 'B' }, 'Fen link');
    expect(look).toEqual({
      icon: 'hourglass_top',
      word: 'One log',
      tone: 'booked',
      note: 'waits for B',
      label: "Fen link, night of Dec 4, 2026: One log, waits for B (station A's log is in; the night waits for station B's)",
      runId: null,
    });
  });
});
