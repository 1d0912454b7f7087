import { LineCount } from '../log/line-counter';
import { CensusMark, LogCensus } from '../log/log-census';
import { ByteRange } from './range-task';

/** A census taken when the log was uploaded, with the SHA-256 of the bytes it was taken from. */
export interface StoredCensus {
  sha256: string;
  census: LogCensus;
}

/** Byte ranges of a plain file and the lines and records of each, as the counting pass would find them. */
export interface CensusRanges {
  ranges: ByteRange[];
  counts: LineCount[];
}

/**
 * Cuts the data of a plain file, [dataOffset, size), into about `parts` ranges at census marks
 * (line starts) near equal shares, with the lines and records of each taken from the census, so
 * no counting pass is needed. The header is the text's line 1 and one record of the census; the
 * ranges start after it. Null when the census cannot describe this file: another size, counts
 * that do not grow, or marks out of order. Whether it is true of the bytes is checked as they
 * are read (see ranged-reading.ts).
 */
export function rangesFromCensus(census: LogCensus, dataOffset: number, size: number, parts: number): CensusRanges | null {
  if (census.decodedBytes !== size || !(census.lines >= 1 && census.records >= 1)) return null;
  const start: CensusMark = { offset: dataOffset, linesBefore: 1, recordsBefore: 1 };
  const end: CensusMark = { offset: size, linesBefore: census.lines, recordsBefore: census.records };
  const marks = [start, ...census.marks.filter((mark) => mark.offset > dataOffset && mark.offset < size), end];
  const ordered = marks.every(
    (mark, i) => i === 0 || (mark.offset > marks[i - 1].offset && mark.linesBefore >= marks[i - 1].linesBefore && mark.recordsBefore >= marks[i - 1].recordsBefore),
  );
  if (!ordered) return null;
  const cuts = [start];
  for (let part = 1; part < parts; part++) {
    const target = dataOffset + ((size - dataOffset) * part) / parts;
    const later = marks.slice(1, -1).filter((mark) => mark.offset > cuts[cuts.length - 1].offset);
    const nearest = later.reduce<CensusMark | null>((best, mark) => (best === null || Math.abs(mark.offset - target) < Math.abs(best.offset - target) ? mark : best), null);
    if (nearest !== null) cuts.push(nearest);
  }
  cuts.push(end);
  const pairs = cuts.slice(1).map((to, i) => [cuts[i], to] as const);
  return {
    ranges: pairs.map(([from, to]) => ({ start: from.offset, end: to.offset })),
    counts: pairs.map(([from, to]) => ({ lines: to.linesBefore - from.linesBefore, records: to.recordsBefore - from.recordsBefore })),
  };
}
