import { isoFromLocal, localDate, localDateTime, moveToNight, nightWindow, tonightWindow, windowProblem } from './booking-window';

describe('nightWindow', () => {
  it('runs from 20:00 on the night to 06:00 the next morning', () => {
    expect(nightWindow('2027-03-14')).toEqual({ night: '2027-03-14', windowStart: '2027-03-14T20:00', windowEnd: '2027-03-15T06:00' });
  });

  it('closes on the next month and year when the night is the last of them', () => {
    expect(nightWindow('2027-02-28').windowEnd).toBe('2027-03-01T06:00');
    expect(nightWindow('2028-02-28').windowEnd).toBe('2028-02-29T06:00');
    expect(nightWindow('2027-12-31').windowEnd).toBe('2028-01-01T06:00');
  });
});

describe('localDate', () => {
  it('gives the calendar date where the browser is, not in UTC', () => {
    expect(localDate(new Date(2027, 2, 14, 23, 30))).toBe('2027-03-14');
    expect(localDate(new Date(2027, 0, 1, 0, 5))).toBe('2027-01-01');
  });
});

describe('tonightWindow', () => {
  it('is tonight from 20:00 while that is still ahead', () => {
    expect(tonightWindow(new Date(2027, 2, 14, 9, 30))).toEqual(nightWindow('2027-03-14'));
  });

  it('opens now once 20:00 has passed, so the booking is not refused as late', () => {
    expect(tonightWindow(new Date(2027, 2, 14, 21, 7, 45))).toEqual({ night: '2027-03-14', windowStart: '2027-03-14T21:07', windowEnd: '2027-03-15T06:00' });
  });
});

describe('moveToNight', () => {
  it('moves the window by whole days and keeps its times, as edited', () => {
    const edited = { night: '2027-03-14', windowStart: '2027-03-14T21:30', windowEnd: '2027-03-15T05:15' };
    expect(moveToNight(edited, '2027-03-16')).toEqual({ night: '2027-03-16', windowStart: '2027-03-16T21:30', windowEnd: '2027-03-17T05:15' });
    expect(moveToNight(edited, '2027-02-28')).toEqual({ night: '2027-02-28', windowStart: '2027-02-28T21:30', windowEnd: '2027-03-01T05:15' });
  });

  it('keeps the wall-clock times across the spring and autumn changes of daylight saving', () => {
    const window = nightWindow('2027-03-20');
    expect(moveToNight(window, '2027-04-03')).toEqual(nightWindow('2027-04-03'));
    expect(moveToNight(nightWindow('2027-10-20'), '2027-11-05')).toEqual(nightWindow('2027-11-05'));
  });

  it('leaves the window as it is for the same night', () => {
    const edited = { night: '2027-03-14', windowStart: '2027-03-14T07:45', windowEnd: '2027-03-14T17:45' };
    expect(moveToNight(edited, '2027-03-14')).toEqual(edited);
  });
});

describe('localDateTime', () => {
  it('is what a datetime-local input holds, to the minute', () => {
    expect(localDateTime(new Date(2027, 2, 4, 7, 5, 59))).toBe('2027-03-04T07:05');
  });
});

describe('isoFromLocal', () => {
  it('reads the input as local time', () => {
    expect(isoFromLocal('2027-03-14T20:00')).toBe(new Date(2027, 2, 14, 20, 0).toISOString());
  });
});

describe('windowProblem', () => {
  const now = new Date(2027, 2, 14, 18, 0);

  it('takes tonight’s default window', () => {
    const { windowStart, windowEnd } = nightWindow('2027-03-14');
    expect(windowProblem(windowStart, windowEnd, now)).toBeNull();
  });

  it('takes a window that opened less than an hour ago, and refuses one that opened earlier', () => {
    expect(windowProblem('2027-03-14T17:05', '2027-03-15T06:00', now)).toBeNull();
    expect(windowProblem('2027-03-14T16:55', '2027-03-15T06:00', now)).toBe('This window opened more than an hour ago: a night is booked before its acquisition.');
  });

  it('refuses a window that closes before it opens, or lasts more than 48 hours', () => {
    expect(windowProblem('2027-03-14T20:00', '2027-03-14T20:00', now)).toBe('The window must close after it opens.');
    expect(windowProblem('2027-03-14T20:00', '2027-03-16T20:00', now)).toBeNull();
    expect(windowProblem('2027-03-14T20:00', '2027-03-16T20:01', now)).toBe('A window lasts at most 48 hours.');
  });

  it('asks for both ends while one is empty', () => {
    expect(windowProblem('', '2027-03-15T06:00', now)).toBe('Give when the window opens and when it closes.');
  });
});
