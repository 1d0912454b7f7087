import { OutcomeEncoding } from '../../log/column-mapping';
import { DamagedGzipError, decodeLog } from '../../node/decoded-log';
import { LogSource, openSource } from '../../node/log-source';
import { Station } from '../station-columns';
import { StationLogReader, StationLogSummary } from '../station-log-reader';
import { StationBatch } from '../station-batch';

/** One reading of a station log file: its rows, then what the reading found. */
export interface StationLogReading {
  /** The valid rows, in batches (each valid until the next is asked for); read once. */
  rows: AsyncIterable<StationBatch>;
  /** What the reading found (complete once `rows` has been read to its end). */
  summary(): StationLogSummary;
  /** Whether the file is gzip, known once its first bytes are read; null before. */
  compression(): 'gzip' | 'none' | null;
}

/**
 * Reads a station log from a file or a stream, plain or gzip (told by its magic bytes, as a joined
 * log is), with the joined log's limits on gzip data: damaged or bomb-like gzip data is a problem of
 * the log, not an exception. Each call reads the source from its start (the join and the alignment
 * scan are separate passes).
 */
export function readStationLog(source: LogSource, station: Station, outcomes: OutcomeEncoding = '0/1'): StationLogReading {
  const reader = new StationLogReader(station, outcomes);
  let compression: 'gzip' | 'none' | null = null;
  async function* rows(): AsyncGenerator<StationBatch> {
    const decoded = await decodeLog(openSource(source), () => undefined);
    compression = decoded.gzip ? 'gzip' : 'none';
    try {
      yield* reader.rows(decoded.chunks);
    } catch (error) {
      if (!(error instanceof DamagedGzipError)) throw error;
      reader.fail(error.message);
    }
  }
  return { rows: rows(), summary: () => reader.summary(), compression: () => compression };
}
