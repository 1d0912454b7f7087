import type { MigrationContext } from '@server/database/migrate';

/**
 * Signed results and re-verifications: the public keys results are signed with (kept after a
 * rotation), each run's signature, and re-analyses kept as their own records. A signed result is
 * fixed at the database level, as the audit trail is.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const sql = (statement: string) => queryInterface.sequelize.query(statement, { transaction });

  await sql(`
    CREATE TABLE signing_keys (
      key_id char(16) PRIMARY KEY,
      public_key_pem text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      retired_at timestamptz
    )`);
  // At most one key signs new results at a time.
  await sql('CREATE UNIQUE INDEX signing_keys_one_current ON signing_keys ((true)) WHERE retired_at IS NULL');

  await sql(`
    ALTER TABLE runs
      ADD COLUMN signing_key_id char(16) REFERENCES signing_keys (key_id) ON DELETE RESTRICT,
      ADD COLUMN signed_at timestamptz,
      ADD COLUMN signature text,
      ADD CONSTRAINT runs_signature_whole CHECK ((signing_key_id IS NULL) = (signature IS NULL) AND (signature IS NULL) = (signed_at IS NULL))`);
  await sql(`
    CREATE FUNCTION refuse_signed_result_change() RETURNS trigger LANGUAGE plpgsql AS $$
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
        OR NEW.file_sha256 IS DISTINCT FROM OLD.file_sha256 OR NEW.verdict IS DISTINCT FROM OLD.verdict
      ) THEN
        RAISE EXCEPTION 'a signed result is fixed; ask for a re-verification instead';
      END IF;
      RETURN NEW;
    END $$`);
  await sql(`
    CREATE TRIGGER runs_signed_result_fixed BEFORE UPDATE OR DELETE ON runs
      FOR EACH ROW EXECUTE FUNCTION refuse_signed_result_change()`);

  await sql(`
    CREATE TABLE run_reverifications (
      id serial PRIMARY KEY,
      run_id integer NOT NULL REFERENCES runs (id) ON DELETE RESTRICT,
      requested_by integer NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      state varchar(16) NOT NULL DEFAULT 'queued'
        CHECK (state IN ('queued', 'analysing', 'reproduced', 'differs', 'failed')),
      stored_fingerprint char(64) NOT NULL,
      stored_engine_version varchar(32) NOT NULL,
      new_fingerprint char(64),
      new_engine_version varchar(32),
      result jsonb,
      differences jsonb NOT NULL DEFAULT '[]',
      difference_count integer NOT NULL DEFAULT 0,
      attempts integer NOT NULL DEFAULT 0,
      error text,
      created_at timestamptz NOT NULL DEFAULT now(),
      started_at timestamptz,
      finished_at timestamptz,
      CHECK ((state IN ('reproduced', 'differs')) = (result IS NOT NULL))
    )`);
  await sql('CREATE INDEX run_reverifications_run ON run_reverifications (run_id, id DESC)');
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const sql = (statement: string) => queryInterface.sequelize.query(statement, { transaction });
  await sql('DROP TABLE run_reverifications');
  await sql('DROP TRIGGER runs_signed_result_fixed ON runs; DROP FUNCTION refuse_signed_result_change()');
  await sql('ALTER TABLE runs DROP CONSTRAINT runs_signature_whole, DROP COLUMN signature, DROP COLUMN signed_at, DROP COLUMN signing_key_id');
  await sql('DROP TABLE signing_keys');
}
