import type { MigrationContext } from '@server/database/migrate';

/**
 * Booked nights and the acquisition computer's upload tokens.
 *
 * - `bookings`: a night booked before acquisition, with the seed drawn then and published only as
 *   its SHA-256 commitment, and the profile version fixed then. One booking per setup and night.
 * - `upload_tokens`: per-setup tokens that may upload and nothing else, stored as SHA-256 hashes.
 * - `runs` gain their booking and attempt (a replacement needs a reason), the replay they repeat,
 *   and the token that uploaded them (a token upload has no person behind it).
 * - `upload_keys` are held by an uploader, a person or a token, instead of a user.
 * - `run_reverifications` may carry another seed (an admin's re-analysis, never a new verdict).
 */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run(`CREATE TABLE bookings (
      id serial PRIMARY KEY,
      setup_id integer NOT NULL REFERENCES setups (id),
      night date NOT NULL,
      window_start timestamptz NOT NULL,
      window_end timestamptz NOT NULL CHECK (window_end > window_start),
      planned_rounds bigint NOT NULL CHECK (planned_rounds > 0),
      profile_version_id integer NOT NULL REFERENCES profile_versions (id),
      profile_reason text NOT NULL DEFAULT '',
      seed char(64) NOT NULL,
      seed_commitment char(64) NOT NULL,
      booked_by integer NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (setup_id, night)
    )`);
  await run(`CREATE TABLE upload_tokens (
      id serial PRIMARY KEY,
      setup_id integer NOT NULL REFERENCES setups (id),
      name varchar(120) NOT NULL,
      token_hash char(64) NOT NULL UNIQUE,
      created_by integer NOT NULL REFERENCES users (id),
      expires_at timestamptz NOT NULL,
      revoked_at timestamptz,
      revoked_by integer REFERENCES users (id),
      last_used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
  await run(`ALTER TABLE runs
      ADD COLUMN booking_id integer REFERENCES bookings (id),
      ADD COLUMN attempt integer CHECK (attempt > 0),
      ADD COLUMN replacement_reason text,
      ADD COLUMN replay_of integer REFERENCES runs (id),
      ADD COLUMN upload_token_id integer REFERENCES upload_tokens (id),
      ALTER COLUMN uploaded_by DROP NOT NULL,
      ADD CONSTRAINT runs_uploader CHECK (uploaded_by IS NOT NULL OR upload_token_id IS NOT NULL),
      ADD CONSTRAINT runs_booking_attempt UNIQUE (booking_id, attempt)`);
  await run(`ALTER TABLE upload_keys ADD COLUMN uploader varchar(40)`);
  await run(`UPDATE upload_keys SET uploader = 'user:' || user_id`);
  await run(`ALTER TABLE upload_keys DROP CONSTRAINT upload_keys_pkey, DROP COLUMN user_id, ALTER COLUMN uploader SET NOT NULL, ADD PRIMARY KEY (uploader, idempotency_key)`);
  await run(`ALTER TABLE run_reverifications ADD COLUMN seed char(64)`);
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
  await run(`ALTER TABLE run_reverifications DROP COLUMN seed`);
  await run(`DELETE FROM upload_keys WHERE uploader NOT LIKE 'user:%'`);
  await run(`ALTER TABLE upload_keys ADD COLUMN user_id integer REFERENCES users (id) ON DELETE CASCADE`);
  await run(`UPDATE upload_keys SET user_id = substr(uploader, 6)::integer`);
  await run(`ALTER TABLE upload_keys DROP CONSTRAINT upload_keys_pkey, DROP COLUMN uploader, ALTER COLUMN user_id SET NOT NULL, ADD PRIMARY KEY (user_id, idempotency_key)`);
  await run(`DELETE FROM runs WHERE upload_token_id IS NOT NULL AND uploaded_by IS NULL`);
  await run(`ALTER TABLE runs DROP CONSTRAINT runs_booking_attempt, DROP CONSTRAINT runs_uploader,
      DROP COLUMN booking_id, DROP COLUMN attempt, DROP COLUMN replacement_reason, DROP COLUMN replay_of, DROP COLUMN upload_token_id,
      ALTER COLUMN uploaded_by SET NOT NULL`);
  await run('DROP TABLE upload_tokens');
  await run('DROP TABLE bookings');
}
