import { readLogHead } from './log-head';

const mapping = { columns: {}, outcomes: '0/1' as const };
const headOf = (text: string) => readLogHead(new TextEncoder().encode(text), true, mapping, false);

describe('readLogHead', () => {
  it.each([
    ['round;x;y;a;b\n0;0;1;1;0\n', 'semicolons (;)'],
    ['round\tx\ty\ta\tb\n0\t0\t1\t1\t0\n', 'tabs'],
    ['round|x|y|a|b\n0|0|1|1|0\n', 'vertical bars (|)'],
  ])('names the separator of a header written without commas: %j', (text, named) => {
    expect(headOf(text)).toEqual({
      ok: false,
      problem: {
        line: 1,
        column: null,
        value: null,
        message: `the header line is one column: its fields are separated by ${named}, and a round log separates them with commas`,
      },
    });
  });

  it('reads a comma header that also holds a semicolon inside a quoted name', () => {
    const head = headOf('round,x,y,a,b,"note; free text"\n0,0,1,1,0,ok\n');
    expect(head.ok && head.layout.columnNames).toEqual(['round', 'x', 'y', 'a', 'b', 'note; free text']);
  });

  it('leaves a one-column header without another separator to the mapping, which names the missing column', () => {
    const head = headOf('round\n0\n');
    if (head.ok) throw new Error('a header with one column was read');
    expect(head.problem.column).toBe('x');
    expect(head.problem.message).toContain('no column "x"');
  });
});
