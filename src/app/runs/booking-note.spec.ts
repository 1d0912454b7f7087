import { bookingNote } from './booking-note';

describe('bookingNote', () => {
  it('says nothing of a booked night’s first log', () => {
    expect(bookingNote({ bookingId: 7, attempt: 1, replayOf: null })).toBeNull();
  });

  it('names the attempt of a replacement', () => {
    expect(bookingNote({ bookingId: 7, attempt: 2, replayOf: null })).toEqual({ text: 'attempt 2', caution: false });
  });

  it('cautions about an unbooked run, and names the earlier run of a replay first', () => {
    expect(bookingNote({ bookingId: null, attempt: null, replayOf: null })).toEqual({ text: 'unbooked', caution: true });
    expect(bookingNote({ bookingId: null, attempt: null, replayOf: 9 })).toEqual({ text: 'replay of 9', caution: true });
  });
});
