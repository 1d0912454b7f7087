/** Where a function of one variable is smallest on an interval, and its value there. */
export interface IntervalMinimum {
  at: number;
  value: number;
}

/** How finely to search: grid points for the scan (ends included, at least 3), then the width at which refining stops. */
export interface IntervalSearch {
  gridPoints: number;
  tolerance: number;
}

/** 1/φ, the golden-section ratio. */
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/**
 * Minimum of f on [low, high]: a scan of an even grid finds the best grid point, then golden-section
 * search (Kiefer, Proc. Amer. Math. Soc. 4, 502 (1953)) narrows the bracket made by its two
 * neighbours until it is narrower than the tolerance. The scan guards against a second basin the
 * golden section alone could fall into; the refinement is exact for a function unimodal on the
 * bracket. The best point seen (grid or refinement) is returned, so a minimum at an end is kept.
 */
export function intervalMinimum(f: (x: number) => number, low: number, high: number, search: IntervalSearch): IntervalMinimum {
  const step = (high - low) / (search.gridPoints - 1);
  let best: IntervalMinimum = { at: low, value: f(low) };
  let bestIndex = 0;
  for (let i = 1; i < search.gridPoints; i++) {
    const at = i === search.gridPoints - 1 ? high : low + i * step;
    const value = f(at);
    if (value < best.value) {
      best = { at, value };
      bestIndex = i;
    }
  }
  let a = Math.max(low, low + (bestIndex - 1) * step);
  let b = Math.min(high, low + (bestIndex + 1) * step);
  let c = b - GOLDEN * (b - a);
  let d = a + GOLDEN * (b - a);
  let fc = f(c);
  let fd = f(d);
  while (b - a > search.tolerance) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - GOLDEN * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + GOLDEN * (b - a);
      fd = f(d);
    }
  }
  const refined = fc < fd ? { at: c, value: fc } : { at: d, value: fd };
  return refined.value < best.value ? refined : best;
}
