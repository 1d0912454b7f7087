/** The same fault again within this window is counted, not printed. */
const QUIET_MS = 30_000;

/** An error in one line: its message and, when the driver gives one, its code (ECONNREFUSED, 57P01...). */
export function oneLine(error: unknown): string {
  if (!(error instanceof Error)) return String(error);
  const code = (error as { code?: unknown }).code;
  const message = error.message.replace(/\s+/g, ' ').trim() || error.name;
  return typeof code === 'string' && !message.includes(code) ? `${message} (${code})` : message;
}

/**
 * One clear line per fault instead of the driver's objects: a database restart makes the job
 * queue report the same failure on every poll, so a repeat within 30 s is only counted, and the
 * count is said with the next line that gets through.
 */
export function faultLines(source: string, write: (line: string) => void = (line) => process.stderr.write(`${line}\n`)) {
  let last = '';
  let lastAt = 0;
  let repeats = 0;
  return (error: unknown): void => {
    const text = oneLine(error);
    const now = Date.now();
    if (text === last && now - lastAt < QUIET_MS) {
      repeats += 1;
      return;
    }
    const before = repeats > 0 ? ` (the previous fault ${repeats} more time${repeats === 1 ? '' : 's'})` : '';
    write(`${source}: ${text}${before}`);
    last = text;
    lastAt = now;
    repeats = 0;
  };
}

/**
 * Whether an error says the database cannot be reached right now (refused, shutting down,
 * restarting, a connection cut): the next query after it comes back will do, so it is no bug.
 */
export function isDatabaseUnreachable(error: unknown): boolean {
  if (!(error instanceof Error)) return false;
  // pg puts the code on the error; Sequelize wraps it (SequelizeConnectionRefusedError, .parent).
  const { code, parent } = error as { code?: unknown; parent?: { code?: unknown } };
  const codes = [code, parent?.code].map(String);
  return (
    codes.some((candidate) => /^(57P0[1-3]|08\d{3}|ECONNREFUSED|ECONNRESET)$/.test(candidate)) ||
    /Connection\w*Error/.test(error.name) ||
    /Connection terminated|ECONNREFUSED|the database system is (shutting down|starting up)/.test(error.message)
  );
}

/**
 * A process that meets an error nobody handled says so in one line and ends (its supervisor starts
 * it again), instead of Node printing the driver's whole object graph. The database being away is
 * the exception: pg-boss 10 does not await its own job-completion writes, so a restart of
 * PostgreSQL at the end of a job rejects one of them unheard. That costs only the write (the job
 * expires and is handed out again, and every job is idempotent), so it is one line and the process
 * goes on.
 */
export function endOnUnhandledFaults(source: string): void {
  const databaseAway = faultLines(source);
  const end = (error: unknown) => {
    if (isDatabaseUnreachable(error)) return databaseAway(error);
    process.stderr.write(`${source}: stopped by an unhandled error: ${oneLine(error)}\n`);
    process.exit(1);
  };
  process.on('uncaughtException', end);
  process.on('unhandledRejection', end);
}
