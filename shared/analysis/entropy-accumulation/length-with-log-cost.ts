/** b = 4/ln 2, so that b·ln y = 4·log2 y. */
const LOG_COST = 4 / Math.LN2;

/**
 * Υ(x), the solution y > 0 of y + b·ln y = x with b = 4/ln 2 (Nadlinger et al., Nature 607, 682
 * (2022), Supplementary Proposition 2): the longest key y whose 4·log2 y bits of hashing cost fit
 * in a budget of x bits.
 *
 * Solved by Newton's method on u = ln y, G(u) = e^u + b·u − x, never through exp(x/b), which
 * overflows for large x. G is increasing and convex, so Newton started where G ≥ 0 (u = ln x for
 * x ≥ 1, where G = b·ln x; u = 0 otherwise, where G = 1 − x) descends monotonically to the root.
 * e^u stays at most max(x, 1).
 */
export function lengthWithLogCost(budget: number): number {
  let u = Math.log(Math.max(budget, 1));
  for (let iteration = 0; iteration < 200; iteration++) {
    const y = Math.exp(u);
    const step = (y + LOG_COST * u - budget) / (y + LOG_COST);
    u -= step;
    if (!(Math.abs(step) > 1e-15 * Math.max(1, Math.abs(u)))) {
      break;
    }
  }
  return Math.exp(u);
}
