/** The parsed command line of `analyse`. */
export interface AnalyseArguments {
  /** Path of the round log. */
  log: string;
  /** Path of the profile JSON file. */
  profile?: string;
  /** Path of the column-mapping JSON file. */
  mapping?: string;
  /** Selection seed, 64 hex digits. */
  seed?: string;
  /** Threads for a plain file (default: automatic). */
  threads?: number;
}

/** A command line that cannot be run, with what is wrong. */
export class UsageError extends Error {}

export const USAGE = 'usage: analyse <log> [--profile <file.json>] [--seed <64 hex>] [--mapping <file.json>] [--threads <n>]';

const VALUE_OPTIONS = ['--profile', '--mapping', '--seed', '--threads'] as const;

/** Parses the arguments after the script name. */
export function parseAnalyseArguments(argv: readonly string[]): AnalyseArguments {
  const values = new Map<string, string>();
  const positional: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const argument = argv[i];
    if (!argument.startsWith('--')) {
      positional.push(argument);
      continue;
    }
    const [name, inline] = argument.split(/=(.*)/s, 2);
    if (!(VALUE_OPTIONS as readonly string[]).includes(name)) {
      throw new UsageError(`unknown option ${name}`);
    }
    const value = inline ?? argv[++i];
    if (value === undefined) {
      throw new UsageError(`option ${name} needs a value`);
    }
    values.set(name, value);
  }
  if (positional.length !== 1) {
    throw new UsageError(positional.length === 0 ? 'the round log is missing' : `one round log expected, got ${positional.length}`);
  }
  const threads = values.get('--threads');
  if (threads !== undefined && !/^[1-9][0-9]*$/.test(threads)) {
    throw new UsageError('--threads must be a positive whole number');
  }
  return {
    log: positional[0],
    profile: values.get('--profile'),
    mapping: values.get('--mapping'),
    seed: values.get('--seed'),
    threads: threads === undefined ? undefined : Number(threads),
  };
}
