import { readFile } from 'node:fs/promises';
import type { RunReportDto } from '@shared/api';
import { rederivationChecks, reportProblem, reportSignatureChecks, seedCommitmentCheck, stationPairRederivationChecks, type ReportCheck } from './report-checks';

const USAGE = [
  'usage: npm run --silent verify -- <exported-report.json> <log> [--public-key <key.pem>]',
  '       npm run --silent verify -- <exported-report.json> <station A log> <station B log> [--public-key <key.pem>]',
].join('\n');
/** Exit codes: 0 everything matches, 1 a check failed, 2 a usage or read error. */
const FAILED = 1;
const USAGE_OR_IO_ERROR = 2;

class UsageError extends Error {}

function parseArguments(argv: string[]): { report: string; logs: string[]; publicKey?: string } {
  const positional: string[] = [];
  let publicKey: string | undefined;
  for (let index = 0; index < argv.length; index++) {
    if (argv[index] === '--public-key') {
      publicKey = argv[++index];
      if (publicKey === undefined) throw new UsageError('--public-key needs a PEM file');
    } else if (argv[index].startsWith('--')) throw new UsageError(`unknown option ${argv[index]}`);
    else positional.push(argv[index]);
  }
  if (positional.length < 2 || positional.length > 3) throw new UsageError("give the exported report and its log, or its two station logs (station A's, then station B's)");
  return { report: positional[0], logs: positional.slice(1), publicKey };
}

/** The logs given must be what the report's run was analysed from: one joined log, or two station logs. */
function logsProblem(report: RunReportDto, logs: readonly string[]): string | null {
  const run = `run ${report.run.id}`;
  if (report.stations && logs.length === 1) {
    return `${run} was analysed from two station logs: give station A's log and then station B's log (station B's log is missing)`;
  }
  if (!report.stations && logs.length === 2) {
    return `${run} was analysed from one joined log: give that log alone, not two`;
  }
  return null;
}

async function readText(file: string, what: string): Promise<string> {
  try {
    return await readFile(file, 'utf8');
  } catch (error) {
    throw new UsageError(`cannot read the ${what} ${file}: ${(error as Error).message}`);
  }
}

/**
 * `verify`: checks an exported run report offline, with nothing but the report and the log (or, for
 * a run of two station logs, both of them): the result against its fingerprint, the signature
 * against the report's public key (or a pinned one), the seed against its booking's commitment, and
 * the result re-derived from the log with the report's profile, mapping and seed (and for a pair its
 * stated offset and geometry).
 */
async function main(): Promise<number> {
  const args = parseArguments(process.argv.slice(2));
  let parsed: unknown;
  try {
    parsed = JSON.parse(await readText(args.report, 'report'));
  } catch (error) {
    if (error instanceof UsageError) throw error;
    throw new UsageError(`the report ${args.report} is not valid JSON: ${(error as Error).message}`);
  }
  const problem = reportProblem(parsed);
  if (problem) throw new UsageError(`the report ${args.report} is not a Bellkeep run report: ${problem}`);
  const report = parsed as RunReportDto;
  const mismatch = logsProblem(report, args.logs);
  if (mismatch) throw new UsageError(mismatch);
  const pinned = args.publicKey === undefined ? undefined : await readText(args.publicKey, 'public key');

  const [log, stationBLog] = args.logs;
  const rederived = report.stations ? await stationPairRederivationChecks({ ...report, stations: report.stations }, log, stationBLog) : await rederivationChecks(report, log);
  const checks: ReportCheck[] = [...reportSignatureChecks(report, pinned), seedCommitmentCheck(report), ...rederived];
  for (const check of checks) process.stdout.write(`${check.passed ? '✓' : '✗'} ${check.text}\n`);
  const failed = checks.filter((check) => !check.passed).length;
  process.stdout.write(failed === 0 ? `Run ${report.run.id}: everything matches.\n` : `Run ${report.run.id}: ${failed} check(s) failed.\n`);
  return failed === 0 ? 0 : FAILED;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(error instanceof UsageError ? `verify: ${error.message}\n${USAGE}\n` : `verify: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = USAGE_OR_IO_ERROR;
  },
);
