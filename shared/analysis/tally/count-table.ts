/** Cells of one count table: x ∈ {0,1}, y ∈ {0,1,2}, a, b ∈ {0,1}. */
export const COUNT_CELLS = 2 * 3 * 2 * 2;

/** Counts of rounds by settings and outcomes, `counts[x][y][a][b]`. */
export type CountTable = number[][][][];

/** Index of cell (x, y, a, b) in a flat table. */
export function countCell(x: number, y: number, a: number, b: number): number {
  return ((x * 3 + y) * 2 + a) * 2 + b;
}

/** The nested `counts[x][y][a][b]` form of a flat table. */
export function nestCounts(flat: ArrayLike<number>): CountTable {
  return [0, 1].map((x) => [0, 1, 2].map((y) => [0, 1].map((a) => [0, 1].map((b) => flat[countCell(x, y, a, b)]))));
}
