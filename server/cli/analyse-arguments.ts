/** The parsed command line of `analyse`. */
export interface AnalyseArguments {
  /** Path of the round log, or of station A's log when a pair is given. */
  log: string;
  /** Path of station B's log: the two logs are analysed as a pair. */
  stationB?: string;
  /** Path of the profile JSON file. */
  profile?: string;
  /** Path of the column-mapping JSON file. */
  mapping?: string;
  /** Selection seed, 64 hex digits. */
  seed?: string;
  /** Threads for a plain file (default: automatic). */
  threads?: number;
  /** A pair: station A's round r is joined with B's round r + rounds, for the reason given. */
  statedOffset?: { rounds: number; reason: string };
  /** A pair: where the stations are, for the timing check. */
  geometry?: { stationDistanceM: number; clockOffsetNs: number; clockUncertaintyNs: number };
}

/** A command line that cannot be run, with what is wrong. */
export class UsageError extends Error {}

export const USAGE = [
  'usage: analyse <log> [--profile <file.json>] [--seed <64 hex>] [--mapping <file.json>] [--threads <n>]',
  '       analyse <station A log> <station B log> [--profile <file.json>] [--seed <64 hex>] [--mapping <file.json>] [--offset <k> --offset-reason <text>]',
  '               [--distance-m <m> --clock-offset-ns <ns> --clock-uncertainty-ns <ns>]',
].join('\n');

const VALUE_OPTIONS = ['--profile', '--mapping', '--seed', '--threads', '--offset', '--offset-reason', '--distance-m', '--clock-offset-ns', '--clock-uncertainty-ns'] as const;

/** Options that only a pair of station logs takes. */
const PAIR_OPTIONS = ['--offset', '--offset-reason', '--distance-m', '--clock-offset-ns', '--clock-uncertainty-ns'];
/** Options that only a single round log takes: a pair is read by a thread a station. */
const SINGLE_LOG_OPTIONS = ['--threads'];
const GEOMETRY_OPTIONS = ['--distance-m', '--clock-offset-ns', '--clock-uncertainty-ns'];

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
  if (positional.length === 0 || positional.length > 2) {
    throw new UsageError(positional.length === 0 ? 'the round log is missing' : `one round log or two station logs expected, got ${positional.length}`);
  }
  const pair = positional.length === 2;
  const misplaced = (pair ? SINGLE_LOG_OPTIONS : PAIR_OPTIONS).find((name) => values.has(name));
  if (misplaced !== undefined) {
    throw new UsageError(pair ? `${misplaced} applies to a single round log, not to two station logs` : `${misplaced} needs two station logs`);
  }
  const threads = values.get('--threads');
  if (threads !== undefined && !/^[1-9][0-9]*$/.test(threads)) {
    throw new UsageError('--threads must be a positive whole number');
  }
  return {
    log: positional[0],
    stationB: positional[1],
    profile: values.get('--profile'),
    mapping: values.get('--mapping'),
    seed: values.get('--seed'),
    threads: threads === undefined ? undefined : Number(threads),
    statedOffset: statedOffset(values),
    geometry: geometry(values),
  };
}

/** `--offset k --offset-reason "…"`, both or neither. */
function statedOffset(values: ReadonlyMap<string, string>): AnalyseArguments['statedOffset'] {
  const rounds = values.get('--offset');
  const reason = values.get('--offset-reason');
  if (rounds === undefined && reason === undefined) return undefined;
  if (rounds === undefined || reason === undefined) {
    throw new UsageError('--offset and --offset-reason go together: an offset is applied only with the reason for it');
  }
  if (!/^[+-]?[0-9]+$/.test(rounds)) {
    throw new UsageError('--offset must be a whole number of rounds');
  }
  return { rounds: Number(rounds), reason };
}

/** The three geometry options, all or none. */
function geometry(values: ReadonlyMap<string, string>): AnalyseArguments['geometry'] {
  const given = GEOMETRY_OPTIONS.filter((name) => values.has(name));
  if (given.length === 0) return undefined;
  if (given.length < GEOMETRY_OPTIONS.length) {
    throw new UsageError(`the timing check needs ${GEOMETRY_OPTIONS.join(', ')} together`);
  }
  const [stationDistanceM, clockOffsetNs, clockUncertaintyNs] = GEOMETRY_OPTIONS.map((name) => {
    const text = values.get(name) ?? '';
    const value = text.trim() === '' ? NaN : Number(text);
    if (!Number.isFinite(value)) throw new UsageError(`${name} must be a number`);
    return value;
  });
  return { stationDistanceM, clockOffsetNs, clockUncertaintyNs };
}
