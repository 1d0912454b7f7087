import type { BookingDto } from '@shared/api';
import { openBookings, replacementIn } from './booking-choice';

const booking = (id: number, windowStart: string, windowEnd: string, runIds: number[] = []): BookingDto => ({
  id,
  setupId: 2,
  setupName: 'Fen link',
  night: windowStart.slice(0, 10),
  windowStart,
  windowEnd,
  plannedRounds: 2_000_000,
  profileVersionId: 12,
  profileName: 'Nightly standard',
  profileVersion: 2,
  profileReason: '',
  seedCommitment: '777ddf8cec451a4bdc78edf2e608beeaa3a6b5faa240f5c2edae085b77d51ee6',
  seed: null,
  bookedBy: 'Dev Okafor',
  createdAt: windowStart,
  attempts: runIds.map((runId, index) => ({
    runId,
    attempt: index + 1,
    state: 'aborted',
    verdict: 'ABORT',
    replacementReason: index === 0 ? '' : 'Detector B saturated.',
    createdAt: windowEnd,
  })),
});

describe('openBookings', () => {
  const now = new Date('2027-03-15T08:00:00Z');
  const lastNight = booking(7, '2027-03-14T19:00:00Z', '2027-03-15T05:00:00Z');
  // A long window that closed yesterday morning, 23 hours ago.
  const twoNightsAgo = booking(6, '2027-03-13T19:00:00Z', '2027-03-14T09:00:00Z');
  const longAgo = booking(5, '2027-03-12T19:00:00Z', '2027-03-13T05:00:00Z');
  const tonight = booking(8, '2027-03-15T19:00:00Z', '2027-03-16T05:00:00Z');

  it('keeps the bookings whose window has opened and closed less than a day ago, latest window first', () => {
    expect(openBookings([tonight, twoNightsAgo, lastNight, longAgo], now).map((open) => open.id)).toEqual([7, 6]);
  });

  it('keeps a booking whose window is open now', () => {
    const open = booking(9, '2027-03-15T06:00:00Z', '2027-03-15T12:00:00Z');
    expect(openBookings([lastNight, open], now).map((found) => found.id)).toEqual([9, 7]);
  });

  it('takes a window closed exactly a day ago, not a moment more', () => {
    expect(openBookings([booking(4, '2027-03-13T20:00:00Z', '2027-03-14T08:00:00Z')], now)).toHaveLength(1);
    expect(openBookings([booking(4, '2027-03-13T20:00:00Z', '2027-03-14T07:59:59Z')], now)).toHaveLength(0);
  });

  it('leaves out a window not open yet: the server refuses a log before it', () => {
    expect(openBookings([tonight], now)).toEqual([]);
  });
});

describe('replacementIn', () => {
  it('is nothing for a booking without a log yet, or no booking', () => {
    expect(replacementIn(booking(7, '2027-03-14T19:00:00Z', '2027-03-15T05:00:00Z'))).toBeNull();
    expect(replacementIn(null)).toBeNull();
  });

  it('names the latest run and the attempt the upload becomes', () => {
    expect(replacementIn(booking(7, '2027-03-14T19:00:00Z', '2027-03-15T05:00:00Z', [40, 43]))).toEqual({ runId: 43, attempt: 2, next: 3 });
  });
});
