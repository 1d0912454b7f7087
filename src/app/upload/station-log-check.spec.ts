import { expect } from '@jest/globals';
import type { LogSample } from './log-preview';
import { checkStationLog, type StationLogCheck, stationLogsRefusal } from './station-log-check';

/** A sample holding `text`: the whole file, or only its start. */
function sampleOf(text: string, complete = true): LogSample {
  return { head: new TextEncoder().encode(text), complete, compressed: false };
}

describe('checkStationLog', () => {
  it('reads station A’s log with times, outcomes 0/1, and says what it read', async () => {
    const check = await checkStationLog(sampleOf('round,x,a,t_setting,t_outcome\n1,0,1,1000,2000\n2,1,0,5000,6000\n4,0,0,9000,9900\n'), 'A');
    expect(check).toEqual({ ok: true, outcomes: '0/1', records: 3, firstRound: 1, lastRound: 4, hasTimes: true, complete: true });
  });

  it('takes outcomes as ±1 when only that reads cleanly', async () => {
    const check = await checkStationLog(sampleOf('round,y,b\n7,2,+1\n8,0,-1\n'), 'B');
    expect(check).toMatchObject({ ok: true, outcomes: '±1', records: 2, hasTimes: false });
  });

  it('names what was expected when the header is the other station’s', async () => {
    const check = await checkStationLog(sampleOf('round,y,b\n1,0,1\n'), 'A');
    expect(check).toEqual({
      ok: false,
      cause: 'header',
      message:
        'This is not station A\'s log as Bellkeep reads it: the header has no column "x" for the station A setting; it has: round, y, b (it looks like station B\'s log). ' +
        "Station A's log has the columns round, x, a (and t_setting, t_outcome, both or neither).",
    });
  });

  it('refuses one time column without the other', async () => {
    const check = await checkStationLog(sampleOf('round,y,b,t_setting\n1,0,1,5\n'), 'B');
    expect(check).toMatchObject({ ok: false, cause: 'header' });
    expect(check.ok ? '' : check.message).toContain('the header has column "t_setting" but no "t_outcome": a station log gives both times or neither');
  });

  it('names the first row that breaks the rules, with its line, column and value, under the encoding with fewer problems', async () => {
    const check = await checkStationLog(sampleOf('round,x,a\n1,0,+1\n2,7,-1\n3,1,+1\n'), 'A');
    expect(check).toEqual({
      ok: false,
      cause: 'rows',
      message: 'A row breaks the log rules, so the night would be INVALID: line 3, column x (“7”): the station A setting must be 0 or 1.',
    });
  });

  it('refuses an empty file as no round log', async () => {
    const check = await checkStationLog(sampleOf(''), 'A');
    expect(check).toMatchObject({ ok: false, cause: 'file' });
  });

  it('reads a sample cut off by its size up to its last whole line', async () => {
    const check = await checkStationLog(sampleOf('round,x,a\n1,0,1\n2,1,0\n3,1', false), 'A');
    expect(check).toMatchObject({ ok: true, records: 2, lastRound: 2, complete: false });
  });
});

describe('stationLogsRefusal', () => {
  const clean = (outcomes: '0/1' | '±1'): StationLogCheck => ({ ok: true, outcomes, records: 2, firstRound: 1, lastRound: 2, hasTimes: false, complete: true });

  it('lets one station’s log go alone, or both when they are read one way', () => {
    expect(stationLogsRefusal([{ station: 'B', check: clean('±1') }], false)).toBe('');
    expect(
      stationLogsRefusal(
        [
          { station: 'A', check: clean('0/1') },
          { station: 'B', check: clean('0/1') },
        ],
        false,
      ),
    ).toBe('');
  });

  it('says why the picked logs cannot go', () => {
    expect(stationLogsRefusal([], false)).toBe('Choose station A’s log, station B’s, or both.');
    expect(stationLogsRefusal([{ station: 'A', check: null }], false)).toBe('Reading the start of the logs…');
    expect(
      stationLogsRefusal(
        [
          { station: 'A', check: clean('0/1') },
          { station: 'B', check: { ok: false, cause: 'header', message: '' } },
        ],
        false,
      ),
    ).toBe('Station B’s log would make the night INVALID: choose another file or correct it.');
    expect(stationLogsRefusal([{ station: 'A', check: clean('0/1') }], true)).toContain('station logs do not have: upload one joined log instead');
    expect(
      stationLogsRefusal(
        [
          { station: 'A', check: clean('0/1') },
          { station: 'B', check: clean('±1') },
        ],
        false,
      ),
    ).toBe('The logs write outcomes two ways, station A’s as 0/1 and station B’s as ±1: a night’s two logs are read one way.');
  });
});
