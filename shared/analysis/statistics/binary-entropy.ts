/**
 * Binary (Shannon) entropy in bits, h(p) = −p·log2(p) − (1−p)·log2(1−p), with h(0) = h(1) = 0
 * (Shannon, Bell Syst. Tech. J. 27, 379 (1948)).
 *
 * @example binaryEntropy(0.11) // ≈ 0.4999
 */
export function binaryEntropy(p: number): number {
  if (p <= 0 || p >= 1) {
    return 0;
  }
  return -p * Math.log2(p) - (1 - p) * Math.log2(1 - p);
}
