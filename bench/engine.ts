import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { parseArgs } from 'node:util';
import { withEngineMemory } from '@shared/analysis/node';
import { censusOfBenchLog, gzipBenchLog, writeBenchLog } from './bench-log';

// `npm run bench [-- --rounds 1e7,1e8 --repeat 5 --references-up-to 1e7]`: for each size, a plain
// and a gzip log of the Kestrel Fen model, generated into a temporary folder and deleted after.
// On each: the engine (complete analysis, compiled, a fresh process per run), a numpy loadtxt +
// bincount script and a python3 csv script, in this process tree one after the other, and for
// gzip the decompression alone; the engine again with the census an upload stores (one pass, as
// the worker reads an archived log), and without its row kernel (the byte scanner alone: what the
// kernel buys). Medians of the runs; peak memory the largest; ratios to the engine.

interface Measurement {
  seconds: number;
  peakMB: number;
  rounds: number;
  /** The whole process, start-up included. */
  processSeconds: number;
}

const { values: options } = parseArgs({
  options: { rounds: { type: 'string', default: '1e7,1e8' }, repeat: { type: 'string', default: '3' }, 'references-up-to': { type: 'string', default: '1e7' } },
});
const SIZES = options.rounds.split(',').map(Number);
const REPEAT = Number(options.repeat);
const REFERENCES_UP_TO = Number(options['references-up-to']);
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

function row(what: string, m: Measurement, rounds: number, comparison: string): string {
  const rate = m.rounds > 0 ? `${(rounds / m.seconds / 1e6).toFixed(1).padStart(6)} M rounds/s` : ' '.repeat(17);
  return `  ${what.padEnd(22)} ${m.seconds.toFixed(3).padStart(8)} s  (process ${m.processSeconds.toFixed(2).padStart(6)} s)  ${rate}  peak ${m.peakMB.toFixed(0).padStart(5)} MB  ${comparison}`;
}

async function main(): Promise<void> {
  const folder = mkdtempSync(path.join(tmpdir(), 'bellkeep-bench-'));
  const results: object[] = [];
  process.stdout.write(`engine bench: medians of ${REPEAT} runs each; numpy and csv scripts up to ${REFERENCES_UP_TO} rounds\n`);
  try {
    for (const rounds of SIZES) {
      const plain = path.join(folder, `log-${rounds}.csv`);
      const gzip = `${plain}.gz`;
      process.stderr.write(`generating ${rounds} rounds\n`);
      await writeBenchLog(plain, rounds);
      await gzipBenchLog(plain, gzip);
      for (const file of [plain, gzip]) {
        const compressed = file === gzip;
        process.stdout.write(`\n${path.basename(file)}: ${(statSync(file).size / 1e6).toFixed(1)} MB\n`);
        const engine = measure(withArgs(nodeScript('measure-engine'), file, 'fast'));
        if (engine.rounds !== rounds) throw new Error(`the engine read ${engine.rounds} rounds of ${rounds}`);
        process.stdout.write(`${row('engine', engine, rounds, '')}\n`);
        const result: Record<string, unknown> = { rounds, file: path.basename(file), bytes: statSync(file).size, engine };
        const scannerAlone = measure(withArgs(nodeScript('measure-engine'), file, 'scanner'));
        process.stdout.write(`${row('engine, no row kernel', scannerAlone, rounds, `the kernel makes it ${(scannerAlone.seconds / engine.seconds).toFixed(2)}x faster`)}\n`);
        result['engineWithoutKernel'] = scannerAlone;
        const censusFile = `${file}.census.json`;
        writeFileSync(censusFile, JSON.stringify(await censusOfBenchLog(file)));
        const withCensus = measure(withArgs(nodeScript('measure-engine'), file, 'census', censusFile));
        process.stdout.write(`${row("engine, upload's census", withCensus, rounds, `${(engine.seconds / withCensus.seconds).toFixed(2)}x faster than without`)}\n`);
        result['engineWithCensus'] = withCensus;
        rmSync(censusFile);
        if (compressed) {
          const gunzip = measure(withArgs(nodeScript('measure-gunzip'), file));
          process.stdout.write(
            `${row('decompression alone', gunzip, rounds, `engine ${(engine.seconds / gunzip.seconds).toFixed(2)}x its time, with the census ${(withCensus.seconds / gunzip.seconds).toFixed(2)}x`)}\n`,
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
              `${row(name, reference, rounds, `engine ${(reference.seconds / engine.seconds).toFixed(1)}x faster, with the census ${(reference.seconds / withCensus.seconds).toFixed(1)}x`)}\n`,
            );
            result[name] = reference;
          }
        }
        results.push(result);
      }
      rmSync(plain);
      rmSync(gzip);
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
