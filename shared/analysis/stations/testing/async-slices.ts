/**
 * Specs' stand-in for a stream: `whole` handed out in slices of `size` (bytes of a file, rows of a
 * reader), each on a promise, as an async iterable.
 */
export function asyncSlices<T extends { length: number; slice(start: number, end: number): T }>(whole: T, size: number): AsyncIterable<T> {
  return {
    [Symbol.asyncIterator]() {
      let at = 0;
      return {
        next: () => {
          if (at >= whole.length) return Promise.resolve({ done: true as const, value: undefined });
          const value = whole.slice(at, at + size);
          at += size;
          return Promise.resolve({ done: false as const, value });
        },
      };
    },
  };
}
