import fc from 'fast-check';
import { resolveHeader } from './header-layout';
import { firstRecordLine, LastLineKeeper, lastRecordLine, roundOfLine } from './record-edges';

const text = (bytes: Uint8Array | null) => (bytes === null ? null : new TextDecoder().decode(bytes));
const encode = (value: string) => new TextEncoder().encode(value);

describe('record edges', () => {
  it('finds the first and last non-blank lines, blank lines and CRLF ends aside', () => {
    const bytes = encode('\r\n\n5,0,1,0,1\r\n6,1,1,0,0\n\r\n\n');
    expect(text(firstRecordLine(bytes))).toBe('5,0,1,0,1\r');
    expect(text(lastRecordLine(bytes))).toBe('6,1,1,0,0');
    expect(lastRecordLine(encode('\n\r\n'))).toBeNull();
    expect(text(lastRecordLine(encode('7,0,0,0,0')))).toBe('7,0,0,0,0');
  });

  it('reads the round index under the header layout, quoted or not', () => {
    const resolved = resolveHeader(['x', 'round', 'y', 'a', 'b'], { columns: {}, outcomes: '0/1' }, false);
    if (!resolved.ok) throw new Error(resolved.message);
    expect(roundOfLine(encode('1,"42",0,1,1\r'), resolved.layout)).toBe(42);
    expect(roundOfLine(encode('1,x,0,1,1'), resolved.layout)).toBeNaN();
    expect(roundOfLine(null, resolved.layout)).toBeNaN();
  });

  it('keeps the same last line of a stream however it is cut into chunks', () => {
    const line = fc.oneof(fc.constant(''), fc.constant('\r'), fc.stringMatching(/^[0-9,]{1,12}$/));
    fc.assert(
      fc.property(fc.array(line, { maxLength: 30 }), fc.boolean(), fc.array(fc.nat(200), { maxLength: 10 }), (lines, finalBreak, cuts) => {
        const whole = encode(lines.join('\n') + (finalBreak ? '\n' : ''));
        const keeper = new LastLineKeeper();
        const points = [...new Set(cuts.map((cut) => cut % (whole.length + 1)))].sort((a, b) => a - b);
        let from = 0;
        for (const point of [...points, whole.length]) {
          keeper.push(whole.subarray(from, point));
          from = point;
        }
        return text(keeper.finish()) === text(lastRecordLine(whole));
      }),
    );
  });
});
