import { QueryTypes } from 'sequelize';
import { parseProfile } from '@shared/analysis';
import type { MigrationContext } from '@server/database/migrate';
import { DEMO_PROFILES, DEMO_SETUPS } from './data/demo-lab';

/** The demo lab's acceptance profiles (version 1 each) and its setups with their shift leads. */
export async function up({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const one = async <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    (await queryInterface.sequelize.query<T>(sql, { transaction, replacements, type: QueryTypes.SELECT }))[0];

  for (const profile of DEMO_PROFILES) {
    const parsed = parseProfile(profile.parameters);
    if (!parsed.ok) throw new Error(`Demo profile ${profile.name}: ${parsed.message}`);
    const { id } = await one<{ id: number }>('INSERT INTO profiles (name, description) VALUES (:name, :description) RETURNING id', {
      name: profile.name,
      description: profile.description,
    });
    await queryInterface.sequelize.query("INSERT INTO profile_versions (profile_id, version, parameters, note) VALUES (:id, 1, :parameters, 'First version, from the demo lab.')", {
      transaction,
      replacements: { id, parameters: JSON.stringify(parsed.profile) },
    });
  }
  for (const setup of DEMO_SETUPS) {
    const { id } = await one<{ id: number }>(
      `INSERT INTO setups (name, description, station_a_label, station_b_label, default_profile_id, extra_recipients,
                           station_distance_m, clock_offset_ns, clock_uncertainty_ns)
       VALUES (:name, :description, :stationA, :stationB, (SELECT id FROM profiles WHERE name = :profile),
               ARRAY(SELECT jsonb_array_elements_text(CAST(:extra AS jsonb)))::varchar[],
               :distance, :clockOffset, :clockUncertainty)
       RETURNING id`,
      {
        name: setup.name,
        description: setup.description,
        stationA: setup.stationALabel,
        stationB: setup.stationBLabel,
        profile: setup.profile,
        extra: JSON.stringify(setup.extraRecipients),
        distance: setup.geometry?.stationDistanceM ?? null,
        clockOffset: setup.geometry?.clockOffsetNs ?? null,
        clockUncertainty: setup.geometry?.clockUncertaintyNs ?? null,
      },
    );
    await queryInterface.sequelize.query('INSERT INTO setup_shift_leads (setup_id, user_id) SELECT :id, id FROM users WHERE email IN (:leads)', {
      transaction,
      replacements: { id, leads: [...setup.shiftLeads] },
    });
  }
}

export async function down({ queryInterface, transaction }: MigrationContext): Promise<void> {
  const setupNames = DEMO_SETUPS.map((setup) => setup.name);
  await queryInterface.sequelize.query('DELETE FROM setups WHERE name IN (:setupNames)', { transaction, replacements: { setupNames } });
  const profileNames = DEMO_PROFILES.map((profile) => profile.name);
  await queryInterface.sequelize.query(
    'DELETE FROM profile_versions WHERE profile_id IN (SELECT id FROM profiles WHERE name IN (:profileNames)); DELETE FROM profiles WHERE name IN (:profileNames)',
    { transaction, replacements: { profileNames } },
  );
}
