import { acquisitionDate, latestAcquisitionDate } from './acquisition-date';

describe('the date a log was acquired', () => {
  it('is at the latest today in the earliest zone: the day after today in UTC', () => {
    expect(latestAcquisitionDate(new Date('2026-12-05T18:00:00Z'))).toBe('2026-12-06');
    expect(latestAcquisitionDate(new Date('2026-12-31T23:59:59Z'))).toBe('2027-01-01');
  });

  it('takes today and any earlier date', () => {
    const today = new Date().toISOString().slice(0, 10);
    expect(acquisitionDate.safeParse(today).success).toBe(true);
    expect(acquisitionDate.safeParse('2025-03-13').success).toBe(true);
  });

  it('refuses a date in the future, naming it', () => {
    const parsed = acquisitionDate.safeParse('2999-03-14');
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0].message).toBe('2999-03-14 is in the future: a log is acquired on or before today');
  });

  it('still refuses what is not a date at all with the date message', () => {
    expect(acquisitionDate.safeParse('2026-13-40').error?.issues[0].message).toBe('must be a date as YYYY-MM-DD');
  });
});
