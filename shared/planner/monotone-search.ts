/** The smallest integer in [low, high] where a monotone predicate (false … false, true … true) holds, or null. */
export function firstIndexWhere(low: number, high: number, holds: (index: number) => boolean): number | null {
  if (!holds(high)) return null;
  while (low < high) {
    const middle = Math.floor((low + high) / 2);
    if (holds(middle)) high = middle;
    else low = middle + 1;
  }
  return low;
}
