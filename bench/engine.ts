import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { parseArgs } from 'node:util';
import { withEngineMemory } from '@shared/analysis/node';
import { censusOfBenchLog, gzipBenchLog, writeBenchLog, writeBenchStationPair } from './bench-log';

// `npm run bench [-- --rounds 1e7,1e8 --repeat 5 --references-up-to 1e7 --pairs-up-to 1e7]`: for
// each size, a plain and a gzip log of the Kestrel Fen model, generated into a temporary folder and
// deleted after. On each: the engine (complete analysis, compiled, a fresh process per run), a numpy
// loadtxt + bincount script and a python3 csv script, in this process tree one after the other, and
// for gzip the decompression alone; the engine again with the census an upload stores (one pass, as
// the worker reads an archived log), and without its row kernel (the byte scanner alone: what the
// kernel buys). Then the same rounds as two station logs, plain, without and with times, analysed
// as a pair (with times, the timing check runs too). Medians of the runs; peak memory the largest;
// ratios to the engine on the joined plain log.

interface Measurement {
  seconds: number;
  peakMB: number;
  rounds: number;
  /** The whole process, start-up included. */
  processSeconds: number;
}

const { values: options } = parseArgs({
  options: {
    rounds: { type: 'string', default: '1e7,1e8' },
    repeat: { type: 'string', default: '3' },
    'references-up-to': { type: 'string', default: '1e7' },
    'pairs-up-to': { type: 'string', default: '1e7' },
  },
});
const SIZES = options.rounds.split(',').map(Number);
const REPEAT = Number(options.repeat);
const REFERENCES_UP_TO = Number(options['references-up-to']);
const PAIRS_UP_TO = Number(options['pairs-up-to']);
const COMPILED = __filename.endsWith('.js');
/** The project root, from bench/ or from the bundles in dist/server/. */
const ROOT = path.resolve(__dirname, COMPILED ? '../..' : '..');

/** A node script of this folder, compiled or not as this one is. */
function nodeScript(name: string): [string, string[]] {
  return [process.execPath, [...(COMPILED ? [] : ['--import', 'tsx']), path.join(__dirname, `${name}${path.extname(__filename)}`)]];
}

function measureOnce(command: string, args: string[]): Measurement {
  const started = process.hrtime.bigint();
  // The engine runs with the allocator settings its worker gets; the Python references as they are.
  const env = command === process.execPath ? withEngineMemory(process.env) : process.env;
  const printed = execFileSync(command, args, { cwd: ROOT, env, encoding: 'utf8', maxBuffer: 1 << 20 });
  const processSeconds = Number(process.hrtime.bigint() - started) / 1e9;
  return { ...(JSON.parse(printed) as Omit<Measurement, 'processSeconds'>), processSeconds };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** `REPEAT` runs: median times, largest peak memory. */
function measure([command, args]: [string, string[]]): Measurement {
  const runs = Array.from({ length: REPEAT }, () => measureOnce(command, args));
  return {
    seconds: median(runs.map((run) => run.seconds)),
    processSeconds: median(runs.map((run) => run.processSeconds)),
    peakMB: Math.max(...runs.map((run) => run.peakMB)),
    rounds: runs[0].rounds,
  };
}

/** One line of the table: time, rounds/s (when the measurement reads rounds), MB/s of `bytes`, peak memory, a comparison. */
function row(what: string, m: Measurement, rounds: number, bytes: number, comparison: string): string {
  const rate = m.rounds > 0 ? `${(rounds / m.seconds / 1e6).toFixed(2).padStart(6)} M rounds/s` : ' '.repeat(17);
  const throughput = `${(bytes / m.seconds / 1e6).toFixed(0).padStart(5)} MB/s`;
  return `  ${what.padEnd(28)} ${m.seconds.toFixed(3).padStart(8)} s  (process ${m.processSeconds.toFixed(2).padStart(6)} s)  ${rate}  ${throughput}  peak ${m.peakMB.toFixed(0).padStart(5)} MB  ${comparison}`;
}

/**
 * The same rounds as two station logs, without and with times, analysed as a pair: rows beside the
 * joined plain log's engine time `joined`. The files are deleted after.
 */
async function measurePairs(folder: string, rounds: number, joined: Measurement): Promise<object[]> {
  const results: object[] = [];
  for (const times of [false, true]) {
    process.stderr.write(`generating ${rounds} rounds as two station logs${times ? ' with times' : ''}\n`);
    const [a, b] = await writeBenchStationPair(folder, rounds, times);
    const bytes = statSync(a).size + statSync(b).size;
    const what = `station pair${times ? ', timed' : ''}`;
    process.stdout.write(`\n${what}: ${path.basename(a)} and ${path.basename(b)}, ${(bytes / 1e6).toFixed(1)} MB together, the same rounds as the joined log\n`);
    const pair = measure(withArgs(nodeScript('measure-engine'), a, 'pair', b));
    if (pair.rounds !== rounds) throw new Error(`the pair joined ${pair.rounds} rounds of ${rounds}`);
    process.stdout.write(`${row(`engine, ${what}`, pair, rounds, bytes, `${(pair.seconds / joined.seconds).toFixed(1)}x the joined plain log's time`)}\n`);
    results.push({ rounds, file: what, bytes, engine: pair });
    rmSync(a);
    rmSync(b);
  }
  return results;
}

async function main(): Promise<void> {
  const folder = mkdtempSync(path.join(tmpdir(), 'bellkeep-bench-'));
  const results: object[] = [];
  process.stdout.write(`engine bench: medians of ${REPEAT} runs each; numpy and csv scripts up to ${REFERENCES_UP_TO} rounds, two station logs up to ${PAIRS_UP_TO}\n`);
  try {
    for (const rounds of SIZES) {
      let joinedPlain: Measurement | undefined;
      const plain = path.join(folder, `log-${rounds}.csv`);
      const gzip = `${plain}.gz`;
      process.stderr.write(`generating ${rounds} rounds\n`);
      await writeBenchLog(plain, rounds);
      await gzipBenchLog(plain, gzip);
      for (const file of [plain, gzip]) {
        const compressed = file === gzip;
        process.stdout.write(`\n${path.basename(file)}: ${(statSync(file).size / 1e6).toFixed(1)} MB\n`);
        const bytes = statSync(file).size;
        const engine = measure(withArgs(nodeScript('measure-engine'), file, 'fast'));
        if (engine.rounds !== rounds) throw new Error(`the engine read ${engine.rounds} rounds of ${rounds}`);
        process.stdout.write(`${row('engine', engine, rounds, bytes, '')}\n`);
        if (!compressed) joinedPlain = engine;
        const result: Record<string, unknown> = { rounds, file: path.basename(file), bytes, engine };
        const scannerAlone = measure(withArgs(nodeScript('measure-engine'), file, 'scanner'));
        process.stdout.write(`${row('engine, no row kernel', scannerAlone, rounds, bytes, `the kernel makes it ${(scannerAlone.seconds / engine.seconds).toFixed(2)}x faster`)}\n`);
        result['engineWithoutKernel'] = scannerAlone;
        const censusFile = `${file}.census.json`;
        writeFileSync(censusFile, JSON.stringify(await censusOfBenchLog(file)));
        const withCensus = measure(withArgs(nodeScript('measure-engine'), file, 'census', censusFile));
        process.stdout.write(`${row("engine, upload's census", withCensus, rounds, bytes, `${(engine.seconds / withCensus.seconds).toFixed(2)}x faster than without`)}\n`);
        result['engineWithCensus'] = withCensus;
        rmSync(censusFile);
        if (compressed) {
          const gunzip = measure(withArgs(nodeScript('measure-gunzip'), file));
          process.stdout.write(
            `${row('decompression alone', gunzip, rounds, bytes, `engine ${(engine.seconds / gunzip.seconds).toFixed(2)}x its time, with the census ${(withCensus.seconds / gunzip.seconds).toFixed(2)}x`)}\n`,
          );
          result['gunzip'] = gunzip;
        }
        if (rounds > REFERENCES_UP_TO) {
          process.stdout.write(`  (numpy and csv scripts skipped above ${REFERENCES_UP_TO} rounds: minutes each; --references-up-to raises it)\n`);
        } else {
          for (const [name, script] of [
            ['numpy loadtxt', 'numpy_loadtxt.py'],
            ['python3 csv', 'count_rounds.py'],
          ] as const) {
            const reference = measure(['python3', [path.join(ROOT, 'bench', script), file]]);
            process.stdout.write(
              `${row(name, reference, rounds, bytes, `engine ${(reference.seconds / engine.seconds).toFixed(1)}x faster, with the census ${(reference.seconds / withCensus.seconds).toFixed(1)}x`)}\n`,
            );
            result[name] = reference;
          }
        }
        results.push(result);
      }
      rmSync(plain);
      rmSync(gzip);
      if (rounds > PAIRS_UP_TO) {
        process.stdout.write(`\n  (two station logs skipped above ${PAIRS_UP_TO} rounds: minutes to write and to analyse; --pairs-up-to raises it)\n`);
      } else {
        results.push(...(await measurePairs(folder, rounds, joinedPlain!)));
      }
    }
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
  process.stdout.write(`\n${JSON.stringify({ bench: 'engine', repeat: REPEAT, results })}\n`);
}

function withArgs([command, args]: [string, string[]], ...more: string[]): [string, string[]] {
  return [command, [...args, ...more]];
}

void main();
