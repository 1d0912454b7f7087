import { StationBatch } from '../station-batch';
import { StationRow } from '../station-row';

/** Specs' stand-in for a station reader: the rows in batches of `size`, each on a promise. */
export function stationBatches(rows: readonly StationRow[], size: number, timed = rows.some((row) => row.settingTime !== null)): AsyncIterable<StationBatch> {
  return {
    async *[Symbol.asyncIterator]() {
      for (let at = 0; at < rows.length; at += size) yield await Promise.resolve(StationBatch.of(rows.slice(at, at + size), timed));
    },
  };
}
