import { readFileSync } from 'node:fs';
import { analyseLog, type StoredCensus } from '@shared/analysis/node';

// One measurement in a fresh process (so peak memory is its own): `node dist/server/measure-engine.js
// <log> <fast|scanner|reference|census> [census.json]` prints {seconds, peakMB, rounds, verdict} as JSON;
// seconds from before the analysis to its result, so process start-up is not in it (the bench times
// that apart). `scanner`: the byte scanner without the row kernel. `census`: the fast reader with the census an upload would have stored (as the worker runs).
async function main(): Promise<void> {
  const [log, reader, censusFile] = process.argv.slice(2);
  const census = reader === 'census' ? (JSON.parse(readFileSync(censusFile, 'utf8')) as StoredCensus) : undefined;
  const misfit = (reason: string) => {
    throw new Error(`the census does not fit: ${reason}`);
  };
  const started = process.hrtime.bigint();
  const result = await analyseLog(
    { path: log },
    { seed: '5e'.repeat(32), reader: reader === 'reference' || reader === 'scanner' ? reader : 'fast', census, onCensusMismatch: misfit },
  );
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  const peakMB = process.resourceUsage().maxRSS / 1024;
  process.stdout.write(JSON.stringify({ seconds, peakMB, rounds: result.input.rounds, verdict: result.verdict }) + '\n');
}

void main();
