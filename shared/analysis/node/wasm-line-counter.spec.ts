import fc from 'fast-check';
import { LineCounter, LineCounting } from '../log/line-counter';
import { createLineCounter } from './wasm-line-counter';

/** Pushes `text` cut at `cuts` (positions, any order, repeats allowed) and returns peek after each push and the totals. */
function countInPieces(counter: LineCounting, text: Uint8Array, cuts: number[]) {
  const points = [...new Set(cuts.map((cut) => cut % (text.length + 1)))].sort((a, b) => a - b);
  const peeks = [];
  let from = 0;
  for (const point of [...points, text.length]) {
    counter.push(text.subarray(from, point));
    peeks.push(counter.peek());
    from = point;
  }
  return { peeks, totals: counter.finish() };
}

describe('the WebAssembly line count', () => {
  it('is built, so the engine counts with it', () => {
    expect(createLineCounter()).not.toBeInstanceOf(LineCounter);
  });

  it('counts lines and records as the TypeScript rule does, however the text is cut (blank lines, lone CRs, CRLF across cuts, pieces past 16 bytes)', () => {
    // Lines of every kind the rule tells apart, long ones so that whole 16-byte steps hold line breaks at every offset.
    const line = fc.oneof(fc.constant(''), fc.constant('\r'), fc.constant('\r\r'), fc.stringMatching(/^[0-9,\r]{1,40}$/), fc.constant('12,0,1,1,0\r'));
    fc.assert(
      fc.property(fc.array(line, { maxLength: 80 }), fc.boolean(), fc.array(fc.nat(4000), { maxLength: 12 }), (lines, finalBreak, cuts) => {
        const text = new TextEncoder().encode(lines.join('\n') + (finalBreak ? '\n' : ''));
        expect(countInPieces(createLineCounter(), text, cuts)).toEqual(countInPieces(new LineCounter(), text, cuts));
      }),
      { numRuns: 500 },
    );
  });

  it('counts a text longer than one piece of its memory (1 MiB) the same: the header, 70 010 rows, two blank lines', () => {
    const row = '1234567,1,0,1,1\n';
    const text = new TextEncoder().encode(`round,x,y,a,b\n${row.repeat(70_000)}\n\r\n${row.repeat(10)}`);
    const fast = createLineCounter();
    fast.push(text);
    const rule = new LineCounter();
    rule.push(text);
    expect(fast.finish()).toEqual({ lines: 70_013, records: 70_011 });
    expect(rule.finish()).toEqual({ lines: 70_013, records: 70_011 });
  });
});
