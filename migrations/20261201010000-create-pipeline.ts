import type { MigrationContext } from '@server/database/migrate';

/**
 * The runs pipeline: versioned acceptance profiles, setups with their shift leads, the
 * content-addressed archive, runs with their results, sign-offs, mail deliveries, and the
 * append-only audit trail. Rules that must hold whatever the code does live here as constraints
 * and triggers.
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const sql = (statement: string) => queryInterface.sequelize.query(statement, { transaction });

  await sql(`
    CREATE TABLE profiles (
      id serial PRIMARY KEY,
      name varchar(120) NOT NULL,
      description text NOT NULL DEFAULT '',
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
  await sql('CREATE UNIQUE INDEX profiles_name_lower ON profiles (lower(name))');

  await sql(`
    CREATE TABLE profile_versions (
      id serial PRIMARY KEY,
      profile_id integer NOT NULL REFERENCES profiles (id) ON DELETE RESTRICT,
      version integer NOT NULL CHECK (version >= 1),
      parameters jsonb NOT NULL,
      note text NOT NULL DEFAULT '',
      created_by integer REFERENCES users (id) ON DELETE RESTRICT,
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (profile_id, version)
    )`);
  // A version, once written, is fixed: editing a profile writes a new version.
  await sql(`
    CREATE FUNCTION refuse_profile_version_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'profile versions are fixed once written; create a new version instead';
    END $$`);
  await sql(`
    CREATE TRIGGER profile_versions_fixed BEFORE UPDATE ON profile_versions
      FOR EACH ROW EXECUTE FUNCTION refuse_profile_version_change()`);

  await sql(`
    CREATE TABLE setups (
      id serial PRIMARY KEY,
      name varchar(120) NOT NULL,
      description text NOT NULL DEFAULT '',
      station_a_label varchar(120) NOT NULL,
      station_b_label varchar(120) NOT NULL,
      default_profile_id integer NOT NULL REFERENCES profiles (id) ON DELETE RESTRICT,
      extra_recipients varchar(320)[] NOT NULL DEFAULT '{}',
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);
  await sql('CREATE UNIQUE INDEX setups_name_lower ON setups (lower(name))');
  await sql(`
    CREATE TABLE setup_shift_leads (
      setup_id integer NOT NULL REFERENCES setups (id) ON DELETE CASCADE,
      user_id integer NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      PRIMARY KEY (setup_id, user_id)
    )`);

  await sql(`
    CREATE TABLE archive_files (
      sha256 char(64) PRIMARY KEY CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      bytes bigint NOT NULL CHECK (bytes >= 0),
      created_at timestamptz NOT NULL DEFAULT now()
    )`);

  await sql(`
    CREATE TABLE runs (
      id serial PRIMARY KEY,
      setup_id integer NOT NULL REFERENCES setups (id) ON DELETE RESTRICT,
      profile_version_id integer NOT NULL REFERENCES profile_versions (id) ON DELETE RESTRICT,
      file_sha256 char(64) NOT NULL REFERENCES archive_files (sha256) ON DELETE RESTRICT,
      original_name varchar(255) NOT NULL DEFAULT '',
      duplicate_of integer REFERENCES runs (id) ON DELETE RESTRICT,
      uploaded_by integer NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      acquired_on date,
      notes text NOT NULL DEFAULT '',
      mapping jsonb,
      seed char(64) NOT NULL CHECK (seed ~ '^[0-9a-f]{64}$'),
      state varchar(16) NOT NULL DEFAULT 'queued'
        CHECK (state IN ('queued', 'analysing', 'accepted', 'aborted', 'invalid', 'failed')),
      progress double precision NOT NULL DEFAULT 0 CHECK (progress >= 0 AND progress <= 1),
      attempts integer NOT NULL DEFAULT 0,
      analysed_by varchar(255),
      verdict varchar(8) CHECK (verdict IN ('ACCEPT', 'ABORT', 'INVALID')),
      result jsonb,
      error text,
      created_at timestamptz NOT NULL DEFAULT now(),
      started_at timestamptz,
      finished_at timestamptz,
      CHECK ((state IN ('accepted', 'aborted', 'invalid')) = (result IS NOT NULL))
    )`);
  await sql('CREATE INDEX runs_setup_created ON runs (setup_id, created_at DESC)');
  await sql('CREATE INDEX runs_state ON runs (state)');

  await sql(`
    CREATE TABLE run_sign_offs (
      run_id integer PRIMARY KEY REFERENCES runs (id) ON DELETE RESTRICT,
      user_id integer NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      comment text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);

  await sql(`
    CREATE TABLE mail_deliveries (
      id serial PRIMARY KEY,
      run_id integer NOT NULL REFERENCES runs (id) ON DELETE RESTRICT,
      recipients varchar(320)[] NOT NULL,
      status varchar(8) NOT NULL CHECK (status IN ('sent', 'failed')),
      message_id varchar(255),
      error text,
      attempted_at timestamptz NOT NULL DEFAULT now()
    )`);
  // At most one successful verdict mail per run.
  await sql("CREATE UNIQUE INDEX mail_deliveries_one_sent ON mail_deliveries (run_id) WHERE status = 'sent'");

  await sql(`
    CREATE TABLE audit_events (
      id bigserial PRIMARY KEY,
      actor_id integer REFERENCES users (id) ON DELETE RESTRICT,
      action varchar(64) NOT NULL,
      target_type varchar(32) NOT NULL,
      target_id varchar(64) NOT NULL,
      details jsonb NOT NULL DEFAULT '{}',
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
  await sql('CREATE INDEX audit_events_target ON audit_events (target_type, target_id)');
  await sql(`
    CREATE FUNCTION refuse_audit_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'the audit trail is append-only';
    END $$`);
  await sql(`
    CREATE TRIGGER audit_events_append_only BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION refuse_audit_change()`);
  await sql(`
    CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
      FOR EACH STATEMENT EXECUTE FUNCTION refuse_audit_change()`);
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  for (const table of ['audit_events', 'mail_deliveries', 'run_sign_offs', 'runs', 'archive_files', 'setup_shift_leads', 'setups', 'profile_versions', 'profiles']) {
    await queryInterface.sequelize.query(`DROP TABLE ${table}`, { transaction });
  }
  await queryInterface.sequelize.query('DROP FUNCTION refuse_audit_change(); DROP FUNCTION refuse_profile_version_change()', { transaction });
}
