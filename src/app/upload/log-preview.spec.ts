import { expect } from '@jest/globals';
import { guessMapping, headerNames, previewLog, readLogSample, type LogSample } from './log-preview';

/** A sample holding the whole of `text`. */
function sampleOf(text: string): LogSample {
  return { head: new TextEncoder().encode(text), complete: true, compressed: false };
}

const millLane = '\ufeffRoundNo,Marked,SetNorth,SetMill,OutNorth,OutMill\n0,0,0,2,+1,+1\n1,1,0,0,+1,+1\n2,0,0,0,-1,-1\n3,1,1,0,-1,+1\n';

describe('readLogSample', () => {
  it('reads a plain log whole when it is short', async () => {
    const sample = await readLogSample(new Blob(['round,x,y,a,b\n0,0,2,1,1\n']));
    expect(sample.compressed).toBe(false);
    expect(sample.complete).toBe(true);
    expect(new TextDecoder().decode(sample.head)).toBe('round,x,y,a,b\n0,0,2,1,1\n');
  });
});

describe('guessMapping', () => {
  it('keeps the trade’s own column names and 0/1 outcomes', () => {
    expect(guessMapping(sampleOf('round,x,y,a,b\n0,0,2,1,1\n'))).toEqual({
      columns: { round: 'round', x: 'x', y: 'y', a: 'a', b: 'b' },
      outcomes: '0/1',
    });
  });

  it('maps another lab’s header by its words, settings and outcomes in station order, and sees ±1 outcomes', () => {
    expect(headerNames(sampleOf(millLane))).toEqual(['RoundNo', 'Marked', 'SetNorth', 'SetMill', 'OutNorth', 'OutMill']);
    expect(guessMapping(sampleOf(millLane))).toEqual({
      columns: { round: 'RoundNo', test: 'Marked', x: 'SetNorth', y: 'SetMill', a: 'OutNorth', b: 'OutMill' },
      outcomes: '±1',
    });
  });
});

describe('previewLog', () => {
  it('reads the first rows under the mapping, outcomes decoded', () => {
    const sample = sampleOf(millLane);
    const preview = previewLog(sample, guessMapping(sample), true);
    expect(preview).toEqual({
      ok: true,
      columns: ['RoundNo', 'Marked', 'SetNorth', 'SetMill', 'OutNorth', 'OutMill'],
      rows: [
        expect.objectContaining({ line: 2, round: { round: 0, x: 0, y: 2, a: 0, b: 0, test: 0 }, problems: [] }),
        expect.objectContaining({ line: 3, round: { round: 1, x: 0, y: 0, a: 0, b: 0, test: 1 } }),
        expect.objectContaining({ line: 4, round: { round: 2, x: 0, y: 0, a: 1, b: 1, test: 0 } }),
        expect.objectContaining({ line: 5, round: { round: 3, x: 1, y: 0, a: 1, b: 0, test: 1 } }),
      ],
    });
  });

  it('refuses a header without a mapped column, naming it and the columns there are', () => {
    const preview = previewLog(sampleOf(millLane), { columns: {}, outcomes: '0/1' }, false);
    expect(preview).toEqual({ ok: false, cause: 'mapping', message: expect.stringContaining('the header has no column "round" for the round index') });
    expect(preview.ok || preview.message).toContain('RoundNo, Marked, SetNorth');
  });

  it('says when the file itself is no round log, empty or binary, rather than blaming the mapping', () => {
    const mapping = { columns: {}, outcomes: '0/1' as const };
    expect(previewLog(sampleOf(''), mapping, false)).toEqual({ ok: false, cause: 'file', message: expect.stringContaining('the file is empty') });
    const binary: LogSample = { head: Uint8Array.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x14]), complete: true, compressed: false };
    expect(previewLog(binary, mapping, false)).toEqual({ ok: false, cause: 'file', message: expect.stringContaining('looks binary') });
  });

  it('names the separator of a log whose fields are not separated by commas', () => {
    const mapping = { columns: {}, outcomes: '0/1' as const };
    expect(previewLog(sampleOf('round;x;y;a;b\n0;0;2;1;1\n'), mapping, false)).toEqual({
      ok: false,
      cause: 'file',
      message: 'the header line is one column: its fields are separated by semicolons (;), and a round log separates them with commas',
    });
    expect(previewLog(sampleOf('round\tx\ty\ta\tb\n0\t0\t2\t1\t1\n'), mapping, false)).toEqual(
      expect.objectContaining({ ok: false, message: expect.stringContaining('separated by tabs') }),
    );
  });

  it('refuses a header without rounds', () => {
    expect(previewLog(sampleOf('round,x,y,a,b\n\n'), { columns: {}, outcomes: '0/1' }, false)).toEqual({
      ok: false,
      cause: 'file',
      message: 'the file has its header line but no rounds',
    });
  });

  it('asks for the test column when the profile takes the test rounds from the log', () => {
    const preview = previewLog(sampleOf('round,x,y,a,b\n0,0,2,1,1\n'), { columns: {}, outcomes: '0/1' }, true);
    expect(preview.ok || preview.message).toContain('no column "test"');
  });

  it('marks rows that break the log rules with the engine’s sentences', () => {
    const sample = sampleOf('round,x,y,a,b\n0,0,2,1,1\n1,3,0,0,0\n1,0,1,0,1\n2,0,1\n');
    const preview = previewLog(sample, guessMapping(sample), false);
    if (!preview.ok) throw new Error(preview.message);
    expect(preview.rows.map((row) => [row.line, row.round === null, row.problems])).toEqual([
      [2, false, []],
      [3, true, ['the station A setting must be 0 or 1']],
      [4, true, [expect.stringContaining('round index 1 repeats')]],
      [5, true, ['the row has 3 fields, the header has 5']],
    ]);
  });

  it('with ±1 outcomes read as 0/1, shows +1 as outcome 1 and calls −1 out of range', () => {
    const sample = sampleOf(millLane);
    const guessed = guessMapping(sample);
    const preview = previewLog(sample, { ...guessed, outcomes: '0/1' }, true);
    if (!preview.ok) throw new Error(preview.message);
    expect(preview.rows[0].round).toEqual(expect.objectContaining({ a: 1, b: 1 }));
    expect(preview.rows[2].problems).toEqual(['the station A outcome must be 0 or 1', 'the station B outcome must be 0 or 1']);
  });

  it('leaves out a last line the sample cut off', () => {
    const preview = previewLog({ ...sampleOf('round,x,y,a,b\n0,0,2,1,1\n1,0,'), complete: false }, { columns: {}, outcomes: '0/1' }, false);
    expect(preview.ok && preview.rows.map((row) => row.line)).toEqual([2]);
  });
});
