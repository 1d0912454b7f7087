import { readFileSync } from 'node:fs';
import { KESTREL_FEN_TIMING } from '@fixtures/stations/station-pair';
import type { AnalysisResult } from '@shared/analysis';
import { analyseLog, analyseStationPair, type StoredCensus } from '@shared/analysis/node';

// One measurement in a fresh process (so peak memory is its own): `node dist/server/measure-engine.js
// <log> <fast|scanner|reference|census> [census.json]` prints {seconds, peakMB, rounds, verdict} as JSON;
// seconds from before the analysis to its result, so process start-up is not in it (the bench times
// that apart). `scanner`: the byte scanner without the row kernel. `census`: the fast reader with the census an upload would have stored (as the worker runs).
// `<station A log> pair <station B log>`: the two station logs analysed as a pair, with the Kestrel
// Fen geometry, so logs with times get their timing check; `rounds` is then the joined rounds.
const SEED = '5e'.repeat(32);

async function main(): Promise<void> {
  const [log, reader, third] = process.argv.slice(2);
  const started = process.hrtime.bigint();
  const result =
    reader === 'pair' ? await analyseStationPair({ path: log }, { path: third }, { seed: SEED, geometry: KESTREL_FEN_TIMING.geometry }) : await analyseOne(log, reader, third);
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  const peakMB = process.resourceUsage().maxRSS / 1024;
  process.stdout.write(JSON.stringify({ seconds, peakMB, rounds: result.input.rounds, verdict: result.verdict }) + '\n');
}

/** One log, read by `reader` (with the census in `censusFile` for `census`). */
function analyseOne(log: string, reader: string, censusFile: string | undefined): Promise<AnalysisResult> {
  const census = reader === 'census' ? (JSON.parse(readFileSync(censusFile!, 'utf8')) as StoredCensus) : undefined;
  const misfit = (reason: string) => {
    throw new Error(`the census does not fit: ${reason}`);
  };
  return analyseLog({ path: log }, { seed: SEED, reader: reader === 'reference' || reader === 'scanner' ? reader : 'fast', census, onCensusMismatch: misfit });
}

void main();
