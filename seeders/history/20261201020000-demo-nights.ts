import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { AnalysisResult } from '@shared/analysis';
import { analyseLog } from '@shared/analysis/node';
import { STATE_OF_VERDICT, type SignOffDecision } from '@shared/api';
import type { SeederContext } from '@server/database/migrate';
import { seedCommitment } from '@server/bookings/seed-commitment';
import { signStatement } from '@server/integrity/signed-statement';
import type { SigningKey } from '@server/integrity/signing-key';
import { putLog } from '@server/storage/log-store';
import { writeModelLog } from '@fixtures/model-log-file';
import { DEMO_SETUPS } from '../data/demo-lab';
import { DEMO_NIGHTS, demoNight, REPLACED_NIGHT, UNBOOKED_NIGHT } from '../data/demo-nights';

const DEMO_NOTE = 'Demo night (invented device model).';

/**
 * Three weeks of invented nightly runs on both demo setups, analysed by the engine itself and
 * archived like uploads, so every screen has data: each night booked the afternoon before (seed
 * committed), except one the lab forgot to book; one night's log replaced with a reason; uploaded
 * by Dev Okafor, signed off by the setup's first shift lead except for the last two nights.
 */
export async function up({ queryInterface, transaction, logStore, signingKey, progress }: SeederContext): Promise<void> {
  if (!signingKey) throw new Error('The demo history is signed like any result: give the seeder the signing key.');
  if (!logStore) throw new Error('The demo history is archived like any upload: give the seeder the log store.');
  const sequelize = queryInterface.sequelize;
  const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) => sequelize.query<T>(sql, { transaction, replacements, type: QueryTypes.SELECT });
  const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'bellkeep-demo-nights-'));
  const [uploader] = await select<{ id: number }>("SELECT id FROM users WHERE email = 'dev.okafor@kestrelfen.example'");
  const today = new Date();
  const totalNights = DEMO_SETUPS.length * DEMO_NIGHTS;
  let nightsDone = 0;

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
        const eve = new Date(Date.parse(acquiredOn) - 86_400_000).toISOString().slice(0, 10);
        const unbooked = setup.name === UNBOOKED_NIGHT.setupName && night === UNBOOKED_NIGHT.night;
        const replaced = setup.name === REPLACED_NIGHT.setupName && night === REPLACED_NIGHT.night;
        let bookingId: number | null = null;
        if (!unbooked) {
          const [booking] = await select<{ id: number }>(
            `INSERT INTO bookings (setup_id, night, window_start, window_end, planned_rounds, profile_version_id, seed, seed_commitment, booked_by, created_at)
             VALUES (:setupId, :night, :windowStart, :windowEnd, :rounds, :versionId, :seed, :commitment, :bookedBy, :bookedAt) RETURNING id`,
            {
              setupId: row.id,
              night: acquiredOn,
              windowStart: `${eve}T20:00:00.000Z`,
              windowEnd: `${acquiredOn}T05:30:00.000Z`,
              rounds: model.rounds,
              versionId: row.version_id,
              seed,
              commitment: seedCommitment(seed),
              bookedBy: uploader.id,
              bookedAt: `${eve}T16:${String(10 + night).padStart(2, '0')}:00.000Z`,
            },
          );
          bookingId = booking.id;
          await sequelize.query(
            "INSERT INTO audit_events (actor_id, action, target_type, target_id, details, created_at) VALUES (:uploader, 'booking.created', 'booking', :id, :details, :at)",
            {
              transaction,
              replacements: {
                uploader: uploader.id,
                id: String(booking.id),
                details: JSON.stringify({ setupId: row.id, night: acquiredOn, seedCommitment: seedCommitment(seed), demo: true }),
                at: `${eve}T16:00:00.000Z`,
              },
            },
          );
        }
        const logs = replaced
          ? [
              { rounds: Math.round(model.rounds * REPLACED_NIGHT.firstShare), attempt: 1, reason: null, minute: 10 + night },
              { rounds: model.rounds, attempt: 2, reason: REPLACED_NIGHT.reason, minute: 40 },
            ]
          : [{ rounds: model.rounds, attempt: unbooked ? null : 1, reason: null, minute: 10 + night }];
        for (const log of logs) {
          const file = path.join(scratch, `demo-${crypto.randomUUID()}.csv`);
          await writeModelLog(file, { ...model, rounds: log.rounds }, seed);
          const result = await analyseLog({ path: file }, { profile: row.parameters, seed });
          await putLog(logStore, fs.createReadStream(file));
          await fs.promises.rm(file);
          const runId = await insertRun(sequelize, transaction, signingKey, {
            setupId: row.id,
            versionId: row.version_id,
            uploader: uploader.id,
            acquiredOn,
            seed,
            result,
            bookingId,
            attempt: log.attempt,
            replacementReason: log.reason,
            name: `${setup.name.toLowerCase().replace(/\W+/g, '-')}-${acquiredOn}.csv`,
            finishedAt: `${acquiredOn}T06:${String(log.minute).padStart(2, '0')}:00.000Z`,
          });
          // Every night but the last two is signed off; of a replaced night, the last attempt only.
          if (log === logs[logs.length - 1]) progress?.(++nightsDone, totalNights);
          if (night < DEMO_NIGHTS - 2 && log === logs[logs.length - 1]) {
            const { decision, comment } = demoSignOff(result);
            const finishedAt = `${acquiredOn}T07:00:00.000Z`;
            await sequelize.query('INSERT INTO run_sign_offs (run_id, user_id, decision, comment, created_at) VALUES (:id, :lead, :decision, :comment, :finishedAt)', {
              transaction,
              replacements: { id: runId, lead: lead.id, decision, comment, finishedAt },
            });
            await sequelize.query(
              "INSERT INTO audit_events (actor_id, action, target_type, target_id, details, created_at) VALUES (:lead, 'run.signed-off', 'run', :id, :details, :finishedAt)",
              {
                transaction,
                replacements: { lead: lead.id, id: String(runId), details: JSON.stringify({ decision, comment, verdict: result.verdict }), finishedAt },
              },
            );
          }
        }
      }
    }
  } finally {
    fs.rmSync(scratch, { recursive: true, force: true });
  }
}

interface DemoRun {
  setupId: number;
  versionId: number;
  uploader: number;
  acquiredOn: string;
  seed: string;
  result: AnalysisResult;
  bookingId: number | null;
  attempt: number | null;
  replacementReason: string | null;
  name: string;
  finishedAt: string;
}

/** One analysed demo run, inserted and signed as the worker would, with its two trail lines. */
async function insertRun(sequelize: Sequelize, transaction: Transaction, signingKey: SigningKey, run: DemoRun): Promise<number> {
  const { result, finishedAt } = run;
  await sequelize.query('INSERT INTO archive_files (sha256, bytes) VALUES (:sha, :bytes) ON CONFLICT DO NOTHING', {
    transaction,
    replacements: { sha: result.input.sha256, bytes: result.input.bytes },
  });
  const [row] = await sequelize.query<{ id: number }>(
    `INSERT INTO runs (setup_id, profile_version_id, file_sha256, original_name, uploaded_by, acquired_on, notes, seed, booking_id, attempt, replacement_reason,
                       state, progress, attempts, verdict, result, created_at, started_at, finished_at)
     VALUES (:setupId, :versionId, :sha, :name, :uploader, :acquiredOn, :notes, :seed, :bookingId, :attempt, :replacementReason, :state, 1, 1, :verdict, :result,
             :finishedAt, :finishedAt, :finishedAt)
     RETURNING id`,
    {
      transaction,
      type: QueryTypes.SELECT,
      replacements: {
        setupId: run.setupId,
        versionId: run.versionId,
        sha: result.input.sha256,
        name: run.name,
        uploader: run.uploader,
        acquiredOn: run.acquiredOn,
        notes: DEMO_NOTE,
        seed: run.seed,
        bookingId: run.bookingId,
        attempt: run.attempt,
        replacementReason: run.replacementReason,
        state: STATE_OF_VERDICT[result.verdict],
        verdict: result.verdict,
        result: JSON.stringify(result),
        finishedAt,
      },
    },
  );
  // Signed as the worker signs (the run id is in the statement, so after the insert).
  const { keyId, signature } = signStatement({ runId: row.id, fileSha256: result.input.sha256, fingerprint: result.fingerprint, signedAt: finishedAt }, signingKey);
  await sequelize.query('UPDATE runs SET signing_key_id = :keyId, signed_at = :finishedAt, signature = :signature WHERE id = :id', {
    transaction,
    replacements: { keyId, finishedAt, signature, id: row.id },
  });
  await sequelize.query(
    `INSERT INTO audit_events (actor_id, action, target_type, target_id, details, created_at) VALUES
       (:uploader, 'run.uploaded', 'run', :id, :uploaded, :finishedAt),
       (NULL, 'run.finished', 'run', :id, :finished, :finishedAt)`,
    {
      transaction,
      replacements: {
        uploader: run.uploader,
        id: String(row.id),
        finishedAt,
        uploaded: JSON.stringify({
          sha256: result.input.sha256,
          bytes: result.input.bytes,
          bookingId: run.bookingId,
          attempt: run.attempt,
          replacementReason: run.replacementReason,
          demo: true,
        }),
        finished: JSON.stringify({ verdict: result.verdict, fingerprint: result.fingerprint, reasons: result.reasons }),
      },
    },
  );
  return row.id;
}

export async function down({ queryInterface, transaction }: SeederContext): Promise<void> {
  await queryInterface.sequelize.query('DELETE FROM run_sign_offs WHERE run_id IN (SELECT id FROM runs WHERE notes = :note)', { transaction, replacements: { note: DEMO_NOTE } });
  await queryInterface.sequelize.query('DELETE FROM runs WHERE notes = :note', { transaction, replacements: { note: DEMO_NOTE } });
  await queryInterface.sequelize.query('DELETE FROM bookings WHERE id NOT IN (SELECT booking_id FROM runs WHERE booking_id IS NOT NULL)', { transaction });
}

/** The shift lead's decision on a demo night: a key is kept when there is one; an ABORT sends someone to the hardware. */
function demoSignOff(result: AnalysisResult): { decision: SignOffDecision; comment: string } {
  if (result.verdict === 'ACCEPT' && (result.key?.finiteKeyBits ?? 0) > 0) return { decision: 'key-kept', comment: 'Steady night.' };
  if (result.verdict === 'ACCEPT') return { decision: 'key-discarded', comment: 'The criteria hold, but the night was too short for a key.' };
  return { decision: 'hardware-action', comment: 'Alignment checked in the morning before the next night.' };
}
