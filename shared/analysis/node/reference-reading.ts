import { createHash } from 'node:crypto';
import { CsvError, Options, parse } from 'csv-parse';
import { HEAD_BYTES, readLogHead } from '../log/log-head';
import { parseIntegerField } from '../log/integer-field';
import { RangeAnalysis } from '../log/range-analysis';
import { planRanges, spanProblem, triggerSpan } from '../log/range-plans';
import { FIELD, ROUND_FIELDS } from '../log/round-fields';
import { aesKeystream } from './aes-keystream';
import { AnalysisRequest } from './analysis-request';
import { DamagedGzipError, decodeLog } from './decoded-log';
import { LogSource, openSource } from './log-source';
import { NO_ROUNDS, ReadOutcome } from './read-outcome';

/**
 * The options that make csv-parse read our dialect: UTF-8 BOM dropped, LF or CRLF ends a record,
 * blank lines skipped, rows of any length returned (the checker counts fields), line numbers kept.
 */
const CSV_DIALECT: Options = { bom: true, relax_column_count: true, record_delimiter: ['\r\n', '\n'], skip_empty_lines: true, info: true };

interface CsvRecord {
  record: string[];
  info: { lines: number };
}

/**
 * The reference reader: the same analysis with csv-parse doing the CSV, one record at a time. Slow
 * but plain; the byte scanner must agree with it (a property test checks), and the benchmark
 * measures it. A csv-parse error (broken quoting) stops the reading with that problem.
 */
export async function readWithCsvParse(source: LogSource, request: AnalysisRequest): Promise<ReadOutcome> {
  const hash = createHash('sha256');
  let bytes = 0;
  const first = await decodeLog(openSource(source), (chunk) => {
    hash.update(chunk);
    bytes += chunk.length;
  });
  const compression = first.gzip ? ('gzip' as const) : ('none' as const);
  const head: Uint8Array[] = [];
  let headLength = 0;
  let records = 0;
  const edgeFields: string[][] = [];
  try {
    const counted = csvRecords(first.chunks, (chunk) => {
      if (headLength < HEAD_BYTES) {
        head.push(chunk.subarray(0, HEAD_BYTES - headLength));
        headLength += head[head.length - 1].length;
      }
    });
    for await (const record of counted) {
      records += record.record.length > 0 ? 1 : 0;
      // The header, the first record and the last record: the edges of the trigger span.
      if (edgeFields.length < 2) edgeFields.push(record.record);
      else edgeFields[2] = record.record;
    }
  } catch (error) {
    if (error instanceof DamagedGzipError) {
      const problem = { line: 0, column: null, value: null, message: error.message };
      return { kind: 'unreadable', input: { sha256: hash.digest('hex'), bytes, rounds: 0, compression }, problems: [problem], problemCount: 1 };
    }
    if (!isCsvError(error)) {
      throw error;
    }
  }
  const headBytes = Buffer.concat(head);
  const logHead = readLogHead(headBytes, headLength < HEAD_BYTES, request.mapping, request.profile.testSelection.mode === 'from-log');
  const input = { sha256: hash.digest('hex'), bytes, rounds: Math.max(records - 1, 0), compression };
  if (!logHead.ok) {
    return { kind: 'unreadable', input, problems: [logHead.problem], problemCount: 1 };
  }
  if (input.rounds === 0) {
    return { kind: 'unreadable', input, problems: [NO_ROUNDS], problemCount: 1 };
  }
  const roundOf = (fields: string[] | undefined) => parseIntegerField(fields?.[logHead.layout.columnOfField[FIELD.round]] ?? '');
  const edges = { firstRound: roundOf(edgeFields[1]), lastRound: roundOf(edgeFields[2] ?? edgeFields[1]), previousRounds: [NaN] };
  const badSpan = spanProblem(triggerSpan(edges, input.rounds), input.rounds, logHead.layout);
  if (badSpan !== null) {
    return { kind: 'unreadable', input, problems: [badSpan], problemCount: 1 };
  }
  const keystream = request.seed === null ? null : aesKeystream(request.seed);
  const [plan] = planRanges(logHead.layout, request.profile, [{ lines: 0, records: input.rounds }], edges);
  const analysis = new RangeAnalysis(plan, keystream);
  const values = new Float64Array(ROUND_FIELDS.length);
  const fieldOfColumn = logHead.layout.fieldOfColumn;
  let header = true;
  try {
    for await (const { record, info } of csvRecords((await decodeLog(openSource(source), () => undefined)).chunks, () => undefined)) {
      if (header) {
        header = false;
        continue;
      }
      values.fill(NaN);
      record.forEach((field, column) => {
        const target = fieldOfColumn[column] ?? -1;
        if (target >= 0) {
          values[target] = parseIntegerField(field);
        }
      });
      analysis.accept(info.lines, values, record.length, () => record);
    }
  } catch (error) {
    if (!isCsvError(error)) {
      throw error;
    }
    analysis.malformed(Number(error.lines), '', error.message);
  }
  return { kind: 'read', input, summary: analysis.summary() };
}

/** csv-parse's records of a byte stream; `onChunk` sees the bytes going in. */
async function* csvRecords(chunks: AsyncIterable<Uint8Array>, onChunk: (chunk: Uint8Array) => void): AsyncGenerator<CsvRecord> {
  const parser = parse(CSV_DIALECT);
  const feed = (async () => {
    for await (const chunk of chunks) {
      onChunk(chunk);
      if (!parser.write(chunk)) {
        await new Promise((resolve) => parser.once('drain', resolve));
      }
    }
    parser.end();
  })();
  feed.catch((error: Error) => parser.destroy(error));
  for await (const record of parser) {
    yield record as CsvRecord;
  }
  await feed;
}

function isCsvError(error: unknown): error is CsvError {
  return error instanceof CsvError;
}
