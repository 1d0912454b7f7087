import { resultDifferences } from './result-differences';

describe('resultDifferences', () => {
  it('finds nothing between equal results, whatever the key order', () => {
    expect(resultDifferences({ a: 1, b: { c: [1, 2] } }, { b: { c: [1, 2] }, a: 1 })).toEqual([]);
  });

  it('names each differing leaf by its path, with both values', () => {
    const stored = { engineVersion: '1.0.0', chsh: { winFraction: 0.85 }, checks: [{ passed: true }, { passed: true }], fingerprint: 'aa' };
    const recomputed = { engineVersion: '1.1.0', chsh: { winFraction: 0.85 }, checks: [{ passed: true }, { passed: false }], fingerprint: 'bb' };
    expect(resultDifferences(stored, recomputed)).toEqual([
      { path: 'checks[1].passed', stored: true, recomputed: false },
      { path: 'engineVersion', stored: '1.0.0', recomputed: '1.1.0' },
    ]);
  });

  it('tells numbers apart to the last bit and reports missing fields as null', () => {
    expect(resultDifferences({ x: 0.1 + 0.2 }, { x: 0.3 })).toEqual([{ path: 'x', stored: 0.30000000000000004, recomputed: 0.3 }]);
    expect(resultDifferences({ blocks: [1] }, { blocks: [1, 2], extra: 'new' })).toEqual([
      { path: 'blocks[1]', stored: null, recomputed: 2 },
      { path: 'extra', stored: null, recomputed: 'new' },
    ]);
  });
});
