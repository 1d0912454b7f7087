import type { MigrationContext } from '@server/database/migrate';

const SIGNED_RESULT_GUARD = (extraColumns: string) => `
  CREATE OR REPLACE FUNCTION refuse_signed_result_change() RETURNS trigger LANGUAGE plpgsql AS $$
  BEGIN
    IF TG_OP = 'DELETE' THEN
      IF OLD.signature IS NOT NULL THEN
        RAISE EXCEPTION 'a run with a signed result is kept';
      END IF;
      RETURN OLD;
    END IF;
    IF OLD.signature IS NOT NULL AND (
      NEW.result IS DISTINCT FROM OLD.result OR NEW.signature IS DISTINCT FROM OLD.signature
      OR NEW.signing_key_id IS DISTINCT FROM OLD.signing_key_id OR NEW.signed_at IS DISTINCT FROM OLD.signed_at
      OR NEW.file_sha256 IS DISTINCT FROM OLD.file_sha256 OR NEW.verdict IS DISTINCT FROM OLD.verdict${extraColumns}
    ) THEN
      RAISE EXCEPTION 'a signed result is fixed; ask for a re-verification instead';
    END IF;
    RETURN NEW;
  END $$`;

/**
 * Two station logs of one night: each station's upload is kept in `station_logs` (archived under
 * its own SHA-256) until the other station's comes; the pair then becomes a run, which records
 * station B's file beside station A's (`file_sha256`), the offset a shift lead stated for a re-run
 * with its reason, and the setup's geometry at the time (so a re-verification uses the same). An
 * upload token may be a station's own. A signed run's pairing is as fixed as its result.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run(`ALTER TABLE runs
      ADD COLUMN station_b_sha256 char(64) REFERENCES archive_files (sha256) ON DELETE RESTRICT,
      ADD COLUMN station_b_name varchar(255),
      ADD COLUMN station_offset integer CHECK (station_offset BETWEEN -16 AND 16),
      ADD COLUMN offset_reason text,
      ADD COLUMN station_geometry jsonb,
      ADD COLUMN realigned_from integer REFERENCES runs (id),
      ADD CONSTRAINT runs_station_b_named CHECK ((station_b_sha256 IS NULL) = (station_b_name IS NULL)),
      ADD CONSTRAINT runs_offset_of_a_pair CHECK (station_offset IS NULL OR station_b_sha256 IS NOT NULL),
      ADD CONSTRAINT runs_offset_with_reason CHECK ((station_offset IS NULL) = (offset_reason IS NULL) AND (offset_reason IS NULL OR btrim(offset_reason) <> ''))`);
  await run(`CREATE TABLE station_logs (
      id serial PRIMARY KEY,
      setup_id integer NOT NULL REFERENCES setups (id),
      station char(1) NOT NULL CHECK (station IN ('A', 'B')),
      booking_id integer REFERENCES bookings (id),
      acquired_on date,
      file_sha256 char(64) NOT NULL REFERENCES archive_files (sha256) ON DELETE RESTRICT,
      original_name varchar(255) NOT NULL DEFAULT '',
      uploaded_by integer REFERENCES users (id),
      upload_token_id integer REFERENCES upload_tokens (id),
      notes text NOT NULL DEFAULT '',
      mapping jsonb,
      run_id integer REFERENCES runs (id),
      superseded_by integer REFERENCES station_logs (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      CHECK (booking_id IS NOT NULL OR acquired_on IS NOT NULL),
      CHECK ((uploaded_by IS NULL) <> (upload_token_id IS NULL))
    )`);
  await run('CREATE INDEX station_logs_waiting ON station_logs (setup_id, station) WHERE run_id IS NULL AND superseded_by IS NULL');
  await run(`ALTER TABLE upload_tokens ADD COLUMN station char(1) CHECK (station IN ('A', 'B'))`);
  await run(
    SIGNED_RESULT_GUARD(`
      OR NEW.station_b_sha256 IS DISTINCT FROM OLD.station_b_sha256 OR NEW.station_offset IS DISTINCT FROM OLD.station_offset
      OR NEW.station_geometry IS DISTINCT FROM OLD.station_geometry`),
  );
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run(SIGNED_RESULT_GUARD(''));
  await run('ALTER TABLE upload_tokens DROP COLUMN station');
  await run('DROP TABLE station_logs');
  for (const constraint of ['runs_station_b_named', 'runs_offset_of_a_pair', 'runs_offset_with_reason']) await run(`ALTER TABLE runs DROP CONSTRAINT ${constraint}`);
  for (const column of ['station_b_sha256', 'station_b_name', 'station_offset', 'offset_reason', 'station_geometry', 'realigned_from'])
    await run(`ALTER TABLE runs DROP COLUMN ${column}`);
}
