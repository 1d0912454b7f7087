import path from 'node:path';
import { parseArgs } from 'node:util';
import { numberOption, UsageError } from '@server/cli/command-options';

export const STORAGE_MODES = ['local', 's3'] as const;
export type StorageMode = (typeof STORAGE_MODES)[number];

export const USAGE = 'usage: npm run bench:pipeline -- [--rounds <N>] [--storage local|s3|both] [--live] [--profile <folder>]';

export interface PipelineOptions {
  /** Rounds of the uploaded log. */
  rounds: number;
  /** Storage modes to measure, in this order. */
  storage: StorageMode[];
  /**
   * Whether the log is generated while it uploads. Otherwise it is generated into memory before the
   * clock starts: the generator (one core) is slower than the pipeline it feeds.
   */
  live: boolean;
  /** Folder for CPU profiles (`--cpu-prof`) of the API and the worker, when asked for. */
  profileFolder?: string;
}

/** The bench's command line. */
export function parsePipelineOptions(argv: string[]): PipelineOptions {
  const values = readArguments(argv);
  const rounds = numberOption({ rounds: values.rounds }, 'rounds') ?? 1e8;
  if (!Number.isSafeInteger(rounds) || rounds < 1) throw new UsageError(`--rounds must be a whole number of rounds, at least 1; it is ${rounds}`);
  const storage = values.storage ?? 'both';
  if (storage !== 'both' && !(STORAGE_MODES as readonly string[]).includes(storage)) {
    throw new UsageError(`--storage must be local, s3 or both; it is ${JSON.stringify(storage)}`);
  }
  return {
    rounds,
    storage: storage === 'both' ? [...STORAGE_MODES] : [storage as StorageMode],
    live: values.live === true,
    profileFolder: values.profile === undefined ? undefined : path.resolve(values.profile),
  };
}

function readArguments(argv: string[]) {
  try {
    return parseArgs({ args: argv, options: { rounds: { type: 'string' }, storage: { type: 'string' }, live: { type: 'boolean' }, profile: { type: 'string' } }, strict: true })
      .values;
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
}
