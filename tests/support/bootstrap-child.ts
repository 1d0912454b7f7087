import { loadConfig } from '@server/config/config';
import { bootstrapDatabase } from '@server/database/bootstrap';
import { openDatabase } from '@server/database/sequelize';

// Run by tsx in a child process: the start-up bootstrap of BELLKEEP_DATABASE_URL with the demo
// history, as `npm start` runs it, at Node's own speed (jest's module sandbox slows the log
// generator and the engine's pure parts about tenfold). Prints the bootstrap report as JSON.
async function main(): Promise<void> {
  const config = loadConfig();
  const database = openDatabase(config.databaseUrl!);
  try {
    const report = await bootstrapDatabase(database, config, { history: true });
    process.stdout.write(JSON.stringify(report));
  } finally {
    await database.close();
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exitCode = 1;
});
