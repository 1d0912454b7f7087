import { analyseLog } from '../shared/analysis/node';

// One measurement in a fresh process (so peak memory is its own): `tsx bench/measure-engine.ts
// <log> <fast|reference>` prints {seconds, peakMB, rounds, verdict} as JSON.
async function main(): Promise<void> {
  const [log, reader] = process.argv.slice(2);
  const started = process.hrtime.bigint();
  const result = await analyseLog({ path: log }, { seed: '5e'.repeat(32), reader: reader === 'reference' ? 'reference' : 'fast' });
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  const peakMB = process.resourceUsage().maxRSS / 1024;
  process.stdout.write(JSON.stringify({ seconds, peakMB, rounds: result.input.rounds, verdict: result.verdict }) + '\n');
}

void main();
