/** The longest a start goes without a line saying what it is doing. */
export const PROGRESS_EVERY_MS = 5_000;

/**
 * Says `what` now and again every 5 s with the time spent (and `detail()`, when it has one) until
 * `work` settles; then once more with the total. A start never sits silent for longer.
 */
export async function withProgress<T>(what: string, work: Promise<T>, say: (line: string) => void, detail: () => string = () => ''): Promise<T> {
  const started = Date.now();
  const seconds = () => `${Math.round((Date.now() - started) / 1000)} s`;
  say(`${what}...`);
  const ticker = setInterval(() => {
    const more = detail();
    say(`${what}... ${seconds()}${more ? `, ${more}` : ''}`);
  }, PROGRESS_EVERY_MS);
  try {
    const result = await work;
    say(`${what}: done in ${seconds()}`);
    return result;
  } finally {
    clearInterval(ticker);
  }
}
