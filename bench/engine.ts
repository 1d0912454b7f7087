import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { writeBenchLog } from './bench-log';

// `npm run bench`: rounds per second and peak memory of the engine, of the csv-parse reference
// pipeline and of a plain python3 csv script, on plain and gzip logs of 10^6 and 10^7 rounds,
// generated into a temporary folder and deleted afterwards.

interface Measurement {
  seconds: number;
  peakMB: number;
  rounds: number;
}

const ROOT = path.resolve(__dirname, '..');
const SIZES = [1_000_000, 10_000_000];
const REFERENCE_UP_TO = 10_000_000;

function measure(command: string, args: string[]): Measurement {
  return JSON.parse(execFileSync(command, args, { cwd: ROOT, encoding: 'utf8', maxBuffer: 1 << 20 })) as Measurement;
}

function row(what: string, file: string, m: Measurement): string {
  const rate = (m.rounds / m.seconds / 1e6).toFixed(2);
  return `${what.padEnd(22)} ${path.basename(file).padEnd(16)} ${String(m.rounds).padStart(9)} rounds ${m.seconds.toFixed(2).padStart(7)} s ${rate.padStart(7)} M rounds/s  peak ${m.peakMB.toFixed(0).padStart(5)} MB`;
}

async function main(): Promise<void> {
  const folder = mkdtempSync(path.join(tmpdir(), 'bellkeep-bench-'));
  const tsx = path.join(ROOT, 'node_modules/.bin/tsx');
  try {
    for (const rounds of SIZES) {
      for (const gzip of [false, true]) {
        const file = path.join(folder, `log-${rounds}${gzip ? '.csv.gz' : '.csv'}`);
        await writeBenchLog(file, rounds, gzip);
        process.stdout.write(`\n${path.basename(file)}: ${(statSync(file).size / 1e6).toFixed(1)} MB\n`);
        process.stdout.write(row('engine', file, measure(tsx, [path.join(__dirname, 'measure-engine.ts'), file, 'fast'])) + '\n');
        if (rounds <= REFERENCE_UP_TO) {
          process.stdout.write(row('csv-parse pipeline', file, measure(tsx, [path.join(__dirname, 'measure-engine.ts'), file, 'reference'])) + '\n');
        }
        process.stdout.write(row('python3 csv script', file, measure('python3', [path.join(__dirname, 'count_rounds.py'), file])) + '\n');
        rmSync(file);
      }
    }
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

void main();
