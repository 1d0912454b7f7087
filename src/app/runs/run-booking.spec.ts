import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { RunBookingDto, RunDto } from '@shared/api';
import { REVEALED_SEED_CAUTION, UNBOOKED_CAUTION } from '@shared/format/booking-words';
import { shownDate } from '../dates/shown-dates';
import { RunBooking } from './run-booking';

const SEED = '9f2c4e81a7d35b60c8e1f4a29b7d03e56a1c8f42e7b90d35c6a2f81e4b7d09c3';
// printf %s 9f2c4e81…4b7d09c3 | sha256sum (GNU coreutils 9.1)
const COMMITMENT = '777ddf8cec451a4bdc78edf2e608beeaa3a6b5faa240f5c2edae085b77d51ee6';

const booking: RunBookingDto = {
  bookingId: 7,
  night: '2027-03-14',
  seedCommitment: COMMITMENT,
  attempt: 2,
  replacementReason: 'Detector B was saturated; log re-read from the second disk.',
  attempts: [
    { runId: 40, attempt: 1, state: 'aborted', verdict: 'ABORT', replacementReason: '', createdAt: '2027-03-15T06:10:00Z' },
    {
      runId: 41,
      attempt: 2,
      state: 'accepted',
      verdict: 'ACCEPT',
      replacementReason: 'Detector B was saturated; log re-read from the second disk.',
      createdAt: '2027-03-15T07:30:00Z',
    },
  ],
};

/** A run with only what the panel reads. */
const runWith = (changes: Partial<RunDto>) => ({ id: 41, seed: SEED, booking: null, replayOf: null, ...changes }) as RunDto;

describe('RunBooking', () => {
  let fixture: ComponentFixture<RunBooking>;

  beforeEach(() => TestBed.configureTestingModule({ providers: [provideRouter([])] }));

  async function show(run: RunDto): Promise<HTMLElement> {
    fixture = TestBed.createComponent(RunBooking);
    fixture.componentRef.setInput('run', run);
    await fixture.whenStable();
    // The browser's SHA-256 answers outside Angular's knowledge: wait for it, then draw again.
    await new Promise((resolve) => setTimeout(resolve, 20));
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  /** The words of an element, its icons left out. */
  function text(element: Element | null): string {
    const copy = element?.cloneNode(true) as Element | undefined;
    copy?.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
    return copy?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  }
  const icon = (element: Element | null) => element?.querySelector('mat-icon')?.textContent?.trim();
  const details = (host: HTMLElement) => Array.from(host.querySelectorAll('li'), (item) => ({ text: text(item), flag: icon(item) ?? null }));

  it('says the attempt, links the other with its verdict, gives the reason and flags the revealed seed', async () => {
    const host = await show(runWith({ booking }));
    const headline = host.querySelector('[data-testid="booking-headline"]');
    expect(icon(headline)).toBe('event_available');
    // The night in the reader's own way of writing a day, as every date of the app.
    expect(text(headline)).toBe(`Booked night ${shownDate('2027-03-14', 'day')} (booking 7): attempt 2 of 2.`);
    expect(details(host)).toEqual([
      { text: `Seed committed at booking, before acquisition: SHA-256 ${COMMITMENT}.`, flag: null },
      { text: 'Replaces the earlier log: Detector B was saturated; log re-read from the second disk.', flag: null },
      { text: REVEALED_SEED_CAUTION, flag: 'flag' },
      { text: 'Other attempts: 1 — run 40, ABORT.', flag: null },
    ]);
    expect(host.querySelector('li a')?.getAttribute('href')).toBe('/runs/40');
  });

  it('checks the revealed seed against the commitment in the browser', async () => {
    const host = await show(runWith({ booking: { ...booking, attempt: 1, attempts: booking.attempts.slice(0, 1) } }));
    expect(text(host.querySelector('[data-testid="commitment-check"]'))).toContain(SEED);
    const outcome = host.querySelector('[data-testid="commitment-outcome"]');
    expect(icon(outcome)).toBe('check_circle');
    expect(text(outcome)).toBe('Seed matches the commitment published at booking');
  });

  it('says plainly when the seed does not match, with what it hashes to', async () => {
    const host = await show(runWith({ booking, seed: `${SEED.slice(0, -1)}4` }));
    const outcome = host.querySelector('[data-testid="commitment-outcome"]');
    expect(outcome?.getAttribute('role')).toBe('alert');
    expect(icon(outcome)).toBe('cancel');
    expect(text(outcome)).toMatch(/^Seed does not match the commitment published at booking: its SHA-256 is [0-9a-f]{64}\.$/);
  });

  it('gives the unbooked caution with its warning icon, and flags a replay with a link to the earlier run', async () => {
    const host = await show(runWith({ replayOf: 9 }));
    const headline = host.querySelector('[data-testid="booking-headline"]');
    expect(icon(headline)).toBe('warning');
    expect(text(headline)).toBe(UNBOOKED_CAUTION);
    expect(details(host)).toEqual([{ text: 'Replay: these bytes were uploaded before as run 9, under another booking or night.', flag: 'flag' }]);
    expect(host.querySelector('li a')?.getAttribute('href')).toBe('/runs/9');
    expect(host.querySelector('[data-testid="commitment-check"]')).toBeNull();
  });

  it('says so when the browser cannot hash (no Web Crypto on a page not served over HTTPS)', async () => {
    const digest = jest.spyOn(crypto.subtle, 'digest').mockRejectedValue(new TypeError('crypto.subtle is undefined'));
    const host = await show(runWith({ booking }));
    digest.mockRestore();
    const outcome = host.querySelector('[data-testid="commitment-outcome"]');
    expect(icon(outcome)).toBe('help');
    expect(text(outcome)).toBe('This browser cannot check the seed here: Web Crypto needs the page served over HTTPS.');
  });
});
