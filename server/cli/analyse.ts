import { readFile } from 'node:fs/promises';
import { AnalysisResult, type OutcomeEncoding, parseColumnMapping, STATION_MAPPING_RULE, stationLogOutcomes } from '@shared/analysis';
import { analyseLog, AnalysisProgress, AnalysisRequestError } from '@shared/analysis/node';
import { analyseStationPair } from '@shared/analysis/stations/node';
import { AnalyseArguments, parseAnalyseArguments, USAGE, UsageError } from './analyse-arguments';

/** Exit codes of the contract: the verdict, or 2 for a usage or I/O error. */
const EXIT_CODE: Record<AnalysisResult['verdict'], number> = { ACCEPT: 0, ABORT: 1, INVALID: 3 };
const USAGE_OR_IO_ERROR = 2;

/** Reads a JSON file named on the command line. */
async function readJson(path: string, what: string): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (error) {
    throw new AnalysisRequestError(`cannot read the ${what} ${path}: ${(error as Error).message}`, 'io');
  }
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    throw new AnalysisRequestError(`the ${what} ${path} is not valid JSON: ${(error as Error).message}`, what === 'profile' ? 'profile' : 'mapping');
  }
}

/** Progress on stderr, at most once per percent. */
function progressPrinter(): (progress: AnalysisProgress) => void {
  let lastShown = '';
  return ({ phase, bytesRead, totalBytes }) => {
    const shown = totalBytes ? `${phase} ${Math.floor((100 * bytesRead) / totalBytes)}%` : `${phase} ${bytesRead} bytes`;
    if (shown !== lastShown) {
      process.stderr.write(`${shown}\n`);
      lastShown = shown;
    }
  };
}

/** How two station logs write their outcomes: the only part of a mapping they take. */
function stationPairOutcomes(mapping: unknown): OutcomeEncoding | undefined {
  if (mapping === undefined) return undefined;
  const parsed = parseColumnMapping(mapping);
  if (!parsed.ok) throw new AnalysisRequestError(parsed.message, 'mapping');
  const outcomes = stationLogOutcomes(parsed.mapping);
  if (outcomes === null) throw new AnalysisRequestError(`mapping: ${STATION_MAPPING_RULE}`, 'mapping');
  return outcomes;
}

/** The analysis the command line asks for: one round log, or two station logs as a pair. */
async function analyse(args: AnalyseArguments): Promise<AnalysisResult> {
  const profile = args.profile === undefined ? undefined : await readJson(args.profile, 'profile');
  const mapping = args.mapping === undefined ? undefined : await readJson(args.mapping, 'mapping');
  if (args.stationB !== undefined) {
    const outcomes = stationPairOutcomes(mapping);
    return analyseStationPair({ path: args.log }, { path: args.stationB }, { profile, outcomes, seed: args.seed, statedOffset: args.statedOffset, geometry: args.geometry });
  }
  return analyseLog(
    { path: args.log },
    {
      profile,
      mapping,
      seed: args.seed,
      threads: args.threads,
      onProgress: progressPrinter(),
    },
  );
}

async function main(): Promise<number> {
  const result = await analyse(parseAnalyseArguments(process.argv.slice(2)));
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
  process.stderr.write(`verdict: ${result.verdict}\n`);
  return EXIT_CODE[result.verdict];
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    if (error instanceof UsageError) {
      process.stderr.write(`analyse: ${error.message}\n${USAGE}\n`);
    } else if (error instanceof AnalysisRequestError) {
      process.stderr.write(`analyse: ${error.message}\n`);
    } else {
      process.stderr.write(`analyse: internal error: ${(error as Error).stack ?? String(error)}\n`);
    }
    process.exitCode = USAGE_OR_IO_ERROR;
  },
);
