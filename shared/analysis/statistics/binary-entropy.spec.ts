import { binaryEntropy } from './binary-entropy';

describe('binaryEntropy', () => {
  it('gives about half a bit at p = 0.11', () => {
    // Textbook value (e.g. Cover & Thomas, Elements of Information Theory): h(0.11) ≈ 0.5.
    expect(binaryEntropy(0.11)).toBeCloseTo(0.4999, 3);
  });

  it('gives one bit at p = 1/2 and nothing at the ends', () => {
    expect(binaryEntropy(0.5)).toBe(1);
    expect(binaryEntropy(0)).toBe(0);
    expect(binaryEntropy(1)).toBe(0);
  });

  it('is symmetric under p ↔ 1 − p', () => {
    for (const p of [0.01, 0.071, 0.2, 0.37]) {
      expect(binaryEntropy(p)).toBeCloseTo(binaryEntropy(1 - p), 12);
    }
  });
});
