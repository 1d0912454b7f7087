import { resolveHeader } from '../log/header-layout';
import { createRowKernel } from './wasm-row-kernel';

// The kernel takes Algorithm S's decision u < n/N (the quotient rounded to a double) by bounds on
// u·N, and divides only when u lies within a hair of the quotient. These cases put u exactly there:
// on the rounded quotient and on the doubles either side of it, for many n and N, and for
// comparison far from it. The rule itself is the TypeScript selector's: `u < n / N`.

/** The double next to `value` towards +∞ (`direction` 1) or −∞ (−1); `value` positive. */
function neighbour(value: number, direction: 1 | -1): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, value);
  view.setBigUint64(0, view.getBigUint64(0) + BigInt(direction));
  return view.getFloat64(0);
}

/**
 * Pairs (n, N): small and large, quotients that are and are not exact in binary, and (the last six,
 * found by search) pairs where fl(fl(n/N)·N) falls below or above n, so a bound without its margin
 * would decide u = fl(n/N) wrongly.
 */
const PAIRS: [number, number][] = [
  [1, 3],
  [2, 3],
  [1, 10],
  [7, 10],
  [1, 2],
  [5_000_000, 10_000_000],
  [3_333_333, 9_999_999],
  [123_456_789, 987_654_321],
  [2 ** 40 + 1, 2 ** 41 + 3],
  [999_999_999_999, 1_000_000_000_001],
  [1, 2 ** 52 - 1],
  [502_874_170_408, 747_075_796_994],
  [55_330_146_594, 174_065_090_562],
  [209_110_479_110, 414_492_721_154],
  [219_572_854_718, 720_349_494_274],
  [252_025_699_306, 493_330_759_682],
  [212_959_540_710, 729_703_907_330],
];

describe('the row kernel decides each fixed-fraction trigger as u < n/N', () => {
  const resolved = resolveHeader(['round', 'x', 'y', 'a', 'b'], { columns: {}, outcomes: '0/1' }, false);
  const kernel = resolved.ok ? createRowKernel(resolved.layout) : null;

  const decision = (u: number, tests: number, triggers: number): number => {
    kernel!.load(Buffer.from('5,0,1,0,1\n'));
    const uniforms = new Float64Array([u]);
    const step = kernel!.step(0, {
      selection: { mode: 0, remainingTests: tests, remainingTriggers: triggers, probability: NaN, uniforms },
      lastRound: 4,
      nextRound: 5,
      spanLastRound: 10,
      recordsLeftInBlock: 10,
    });
    expect(kernel!.rowCount).toBe(1);
    return step.testRounds;
  };

  it('is built (run `npm run build:server` after changing wasm/row-kernel.ts)', () => {
    expect(kernel).not.toBeNull();
  });

  it.each(PAIRS)('on and beside the rounded quotient %d/%d, and far from it', (tests, triggers) => {
    const quotient = tests / triggers;
    const near = [quotient, neighbour(quotient, 1), neighbour(quotient, -1), neighbour(neighbour(quotient, -1), -1), neighbour(neighbour(quotient, 1), 1)];
    const far = [0, quotient / 2, Math.min(quotient * 1.5, 1 - 2 ** -53), 1 - 2 ** -53];
    for (const u of [...near, ...far]) {
      expect([u, decision(u, tests, triggers)]).toEqual([u, Number(u < tests / triggers)]);
    }
  });

  it('never chooses when no test is left, and always when every trigger left must be one', () => {
    expect(decision(0, 0, 5)).toBe(0);
    expect(decision(1 - 2 ** -53, 5, 5)).toBe(1);
  });
});
