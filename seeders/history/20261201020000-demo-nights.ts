import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { analyseLog } from '../../shared/analysis/node';
import { STATE_OF_VERDICT } from '../../shared/api';
import type { SeederContext } from '../../server/database/migrate';
import { signStatement } from '../../server/integrity/signed-statement';
import { putLog } from '../../server/storage/log-store';
import { writeModelLog } from '../../fixtures/model-log-file';
import { DEMO_SETUPS } from '../data/demo-lab';
import { DEMO_NIGHTS, demoNight } from '../data/demo-nights';

/**
 * Three weeks of invented nightly runs on both demo setups, analysed by the engine itself and
 * archived like uploads, so every screen has data: uploaded by Dev Okafor, signed off by the
 * setup's first shift lead except for the last two nights.
 */
export async function up({ queryInterface, transaction, logStore, signingKey }: SeederContext): Promise<void> {
  if (!signingKey) throw new Error('The demo history is signed like any result: give the seeder the signing key.');
  if (!logStore) throw new Error('The demo history is archived like any upload: give the seeder the log store.');
  const sequelize = queryInterface.sequelize;
  const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
    sequelize.query<T>(sql, { transaction, replacements, type: QueryTypes.SELECT });
  const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-demo-nights-'));
  const [uploader] = await select<{ id: number }>("SELECT id FROM users WHERE email = 'dev.okafor@kestrelfen.example'");
  const today = new Date();

  try {
    for (const setup of DEMO_SETUPS) {
      const [row] = await select<{ id: number; version_id: number; parameters: Record<string, unknown> }>(
        `SELECT s.id, v.id AS version_id, v.parameters FROM setups s
           JOIN profile_versions v ON v.profile_id = s.default_profile_id
          WHERE s.name = :name ORDER BY v.version DESC LIMIT 1`,
        { name: setup.name },
      );
      const [lead] = await select<{ id: number }>('SELECT id FROM users WHERE email = :email', { email: setup.shiftLeads[0] });
      for (let night = 0; night < DEMO_NIGHTS; night++) {
        const { model, seed } = demoNight(setup.name, night);
        const acquiredOn = new Date(today.getTime() - (DEMO_NIGHTS - night) * 86_400_000).toISOString().slice(0, 10);
        const file = path.join(scratch, `demo-${crypto.randomUUID()}.csv`);
        await writeModelLog(file, model, seed);
        const result = await analyseLog({ path: file }, { profile: row.parameters, seed });
        await putLog(logStore, fs.createReadStream(file));
        await fs.promises.rm(file);
        await sequelize.query('INSERT INTO archive_files (sha256, bytes) VALUES (:sha, :bytes) ON CONFLICT DO NOTHING', {
          transaction,
          replacements: { sha: result.input.sha256, bytes: result.input.bytes },
        });
        const finishedAt = `${acquiredOn}T06:${String(10 + night).padStart(2, '0')}:00.000Z`;
        const [run] = await select<{ id: number }>(
          `INSERT INTO runs (setup_id, profile_version_id, file_sha256, original_name, uploaded_by, acquired_on, notes, seed,
                             state, progress, attempts, verdict, result, created_at, started_at, finished_at)
           VALUES (:setupId, :versionId, :sha, :name, :uploader, :acquiredOn, :notes, :seed, :state, 1, 1, :verdict, :result,
                   :finishedAt, :finishedAt, :finishedAt)
           RETURNING id`,
          {
            setupId: row.id, versionId: row.version_id, sha: result.input.sha256, name: `${setup.name.toLowerCase().replace(/\W+/g, '-')}-${acquiredOn}.csv`,
            uploader: uploader.id, acquiredOn, notes: 'Demo night (invented device model).', seed, state: STATE_OF_VERDICT[result.verdict],
            verdict: result.verdict, result: JSON.stringify(result), finishedAt,
          },
        );
        // Signed as the worker signs (the run id is in the statement, so after the insert).
        const { keyId, signature } = signStatement({ runId: run.id, fileSha256: result.input.sha256, fingerprint: result.fingerprint, signedAt: finishedAt }, signingKey);
        await sequelize.query('UPDATE runs SET signing_key_id = :keyId, signed_at = :finishedAt, signature = :signature WHERE id = :id', {
          transaction,
          replacements: { keyId, finishedAt, signature, id: run.id },
        });
        await sequelize.query(
          `INSERT INTO audit_events (actor_id, action, target_type, target_id, details, created_at) VALUES
             (:uploader, 'run.uploaded', 'run', :id, :uploaded, :finishedAt),
             (NULL, 'run.finished', 'run', :id, :finished, :finishedAt)`,
          {
            transaction,
            replacements: {
              uploader: uploader.id, id: String(run.id), finishedAt,
              uploaded: JSON.stringify({ sha256: result.input.sha256, bytes: result.input.bytes, demo: true }),
              finished: JSON.stringify({ verdict: result.verdict, fingerprint: result.fingerprint, reasons: result.reasons }),
            },
          },
        );
        if (night < DEMO_NIGHTS - 2) {
          const comment = result.verdict === 'ACCEPT' ? 'Key kept.' : 'Key discarded; hardware checked in the morning.';
          await sequelize.query('INSERT INTO run_sign_offs (run_id, user_id, comment, created_at) VALUES (:id, :lead, :comment, :finishedAt)', {
            transaction,
            replacements: { id: run.id, lead: lead.id, comment, finishedAt },
          });
          await sequelize.query("INSERT INTO audit_events (actor_id, action, target_type, target_id, details, created_at) VALUES (:lead, 'run.signed-off', 'run', :id, :details, :finishedAt)", {
            transaction,
            replacements: { lead: lead.id, id: String(run.id), details: JSON.stringify({ comment, verdict: result.verdict }), finishedAt },
          });
        }
      }
    }
  } finally {
    fs.rmSync(scratch, { recursive: true, force: true });
  }
}

export async function down({ queryInterface, transaction }: SeederContext): Promise<void> {
  await queryInterface.sequelize.query("DELETE FROM run_sign_offs WHERE run_id IN (SELECT id FROM runs WHERE notes = 'Demo night (invented device model).')", { transaction });
  await queryInterface.sequelize.query("DELETE FROM runs WHERE notes = 'Demo night (invented device model).'", { transaction });
}
