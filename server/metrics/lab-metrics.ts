import { collectDefaultMetrics, Gauge, Registry } from 'prom-client';
import { QueryTypes, type Sequelize } from 'sequelize';

interface Row {
  [column: string]: string | number | null;
}

/**
 * The Prometheus metrics of the whole lab, read from the database at each scrape, so they count
 * what every API and worker process did (a counter in one process would see only its own share):
 * queue depth and age, runs by state and verdict, analysis time and bytes, mail deliveries,
 * archived bytes. The process's own (memory, event loop) come with them.
 */
export function labMetrics(sequelize: Sequelize): Registry {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry, prefix: 'bellkeep_api_' });
  const rows = (sql: string) => sequelize.query<Row>(sql, { type: QueryTypes.SELECT });

  new Gauge({
    name: 'bellkeep_queue_jobs',
    help: 'Jobs in the queue not yet done, by queue and state (created and retry wait; active runs).',
    labelNames: ['queue', 'state'],
    registers: [registry],
    async collect() {
      this.reset();
      for (const row of await rows("SELECT name, state::text AS state, count(*)::int AS jobs FROM pgboss.job WHERE state < 'completed' GROUP BY name, state")) {
        this.set({ queue: String(row['name']), state: String(row['state']) }, Number(row['jobs']));
      }
    },
  });
  new Gauge({
    name: 'bellkeep_queue_oldest_waiting_seconds',
    help: 'Age of the oldest job waiting to be taken, by queue (0 when none waits).',
    labelNames: ['queue'],
    registers: [registry],
    async collect() {
      this.reset();
      const sql = "SELECT name, extract(epoch FROM now() - min(created_on))::float AS age FROM pgboss.job WHERE state IN ('created', 'retry') GROUP BY name";
      for (const row of await rows(sql)) this.set({ queue: String(row['name']) }, Number(row['age']));
    },
  });
  new Gauge({
    name: 'bellkeep_runs',
    help: 'Runs by state and verdict (verdict "none" while there is none).',
    labelNames: ['state', 'verdict'],
    registers: [registry],
    async collect() {
      this.reset();
      for (const row of await rows("SELECT state, coalesce(verdict, 'none') AS verdict, count(*)::int AS runs FROM runs GROUP BY state, verdict")) {
        this.set({ state: String(row['state']), verdict: String(row['verdict']) }, Number(row['runs']));
      }
    },
  });
  const finishedRuns = 'FROM runs r JOIN archive_files a ON a.sha256 = r.file_sha256 WHERE r.finished_at IS NOT NULL AND r.started_at IS NOT NULL';
  new Gauge({
    name: 'bellkeep_analysis_seconds_total',
    help: 'Time from the start of analysis to the verdict of the runs that finished, summed (rate() of bellkeep_analysed_bytes_total over rate() of this is bytes per second).',
    registers: [registry],
    async collect() {
      const [row] = await rows(`SELECT coalesce(sum(extract(epoch FROM r.finished_at - r.started_at)), 0)::float AS seconds ${finishedRuns}`);
      this.set(Number(row['seconds']));
    },
  });
  new Gauge({
    name: 'bellkeep_analysed_bytes_total',
    help: 'Bytes of the logs of the runs that finished, summed.',
    registers: [registry],
    async collect() {
      const [row] = await rows(`SELECT coalesce(sum(a.bytes), 0)::float AS bytes ${finishedRuns}`);
      this.set(Number(row['bytes']));
    },
  });
  new Gauge({
    name: 'bellkeep_mail_deliveries',
    help: 'Verdict-mail deliveries by status (each failed attempt is one).',
    labelNames: ['status'],
    registers: [registry],
    async collect() {
      this.reset();
      for (const row of await rows('SELECT status, count(*)::int AS deliveries FROM mail_deliveries GROUP BY status'))
        this.set({ status: String(row['status']) }, Number(row['deliveries']));
    },
  });
  new Gauge({
    name: 'bellkeep_archived_bytes',
    help: 'Bytes of every log in the archive (each distinct file once).',
    registers: [registry],
    async collect() {
      const [row] = await rows('SELECT coalesce(sum(bytes), 0)::float AS bytes FROM archive_files');
      this.set(Number(row['bytes']));
    },
  });
  return registry;
}
