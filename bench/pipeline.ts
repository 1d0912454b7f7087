import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import { UsageError } from '@server/cli/command-options';
import { measurePipeline, type PipelineMeasurement } from './pipeline/measure-pipeline';
import { modelLogChunks } from './pipeline/model-log-chunks';
import { parsePipelineOptions, USAGE } from './pipeline/options';
import { pipelineTable, TARGETS } from './pipeline/pipeline-report';

// `npm run bench:pipeline`: a log of --rounds rounds (default 10^8) of the Kestrel Fen model,
// uploaded through the API (its own process) and analysed by one worker (another), with the local
// archive and with the S3 fake: upload time, time to verdict, peak memory of both processes. A
// table on stdout, then the same as one JSON line; progress on stderr. The log is generated from
// the fixtures' seed into memory first (1.7 GB for 10^8 rounds, never on disk), because the
// generator is slower than the pipeline; `--live` generates it while it uploads instead.

async function main(): Promise<void> {
  const options = parsePipelineOptions(process.argv.slice(2));
  const model = { ...steadyPair, rounds: options.rounds };
  let logChunks: () => Iterable<Buffer> = () => modelLogChunks(model, FIXTURE_SEED);
  let generation: { seconds: number; bytes: number } | null = null;
  if (!options.live) {
    say(`generating the ${options.rounds}-round log into memory (not on disk)`);
    const started = performance.now();
    const chunks = [...modelLogChunks(model, FIXTURE_SEED)];
    generation = { seconds: (performance.now() - started) / 1000, bytes: chunks.reduce((sum, chunk) => sum + chunk.length, 0) };
    say(`  ${(generation.bytes / 1e6).toFixed(0)} MB in ${generation.seconds.toFixed(1)} s (${(options.rounds / generation.seconds / 1e6).toFixed(2)} M rounds/s)`);
    logChunks = () => chunks;
  }

  const measurements: PipelineMeasurement[] = [];
  for (const storage of options.storage) measurements.push(await measurePipeline(storage, logChunks(), { profileFolder: options.profileFolder, say }));

  process.stdout.write(`\n${options.rounds} rounds, log ${options.live ? 'generated while uploading' : 'generated into memory before the clock started'}\n`);
  process.stdout.write(`${pipelineTable(measurements)}\n`);
  process.stdout.write(`${JSON.stringify({ bench: 'pipeline', rounds: options.rounds, live: options.live, generation, targets: TARGETS, measurements })}\n`);
}

function say(line: string): void {
  process.stderr.write(`${line}\n`);
}

main().catch((error: unknown) => {
  if (error instanceof UsageError) process.stderr.write(`bench:pipeline: ${error.message}\n${USAGE}\n`);
  else process.stderr.write(`bench:pipeline failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exitCode = error instanceof UsageError ? 2 : 1;
});
