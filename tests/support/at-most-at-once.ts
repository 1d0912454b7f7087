/** Runs `work` on every item, never more than `atOnce` at the same time; resolves when all are done. */
export async function atMostAtOnce<T>(items: readonly T[], atOnce: number, work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  const lane = async () => {
    while (next < items.length) await work(items[next++]);
  };
  await Promise.all(Array.from({ length: Math.min(atOnce, items.length) }, lane));
}
