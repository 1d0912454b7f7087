import { loadConfig } from '../../server/config/config';
import { bootstrapDatabase } from '../../server/database/bootstrap';
import { DEMO_PEOPLE } from '../../seeders/data/demo-people';
import { createTestDatabase, type TestDatabase } from '../support/test-database';

describe('start-up bootstrap of a database', () => {
  let database: TestDatabase;
  beforeEach(async () => {
    database = await createTestDatabase();
  });
  afterEach(() => database.drop());

  const emails = async () => (await database.models.User.findAll()).map((user) => user.email).sort();

  it('a real deployment: creates the admin named by the environment, once, and no demo people', async () => {
    const config = loadConfig({
      BELLKEEP_DEMO: 'false',
      BELLKEEP_ADMIN_EMAIL: 'Head.Of.Lab@kestrelfen.example',
      BELLKEEP_ADMIN_PASSWORD: 'a-long-admin-password',
      BELLKEEP_BCRYPT_ROUNDS: '4',
    });
    const report = await bootstrapDatabase(database, config);
    expect(report).toEqual({ migrations: [], seeders: [], createdAdmin: 'head.of.lab@kestrelfen.example' });
    expect(await emails()).toEqual(['head.of.lab@kestrelfen.example']);

    const again = await bootstrapDatabase(database, config);
    expect(again.createdAdmin).toBeUndefined();
    expect(await emails()).toEqual(['head.of.lab@kestrelfen.example']);
  });

  it('no admin and none configured: the demo lab’s people arrive, admin among them, once', async () => {
    const config = loadConfig({ BELLKEEP_DEMO: 'false', BELLKEEP_BCRYPT_ROUNDS: '4' });
    const report = await bootstrapDatabase(database, config);
    expect(report.seeders).toEqual(['20261201000000-demo-people.ts', '20261201010000-demo-profiles-and-setups.ts']);
    expect(await emails()).toEqual(DEMO_PEOPLE.map((person) => person.email).sort());
    expect((await bootstrapDatabase(database, config)).seeders).toEqual([]);
  });
});

describe('configuration', () => {
  it('names the bad variable', () => {
    expect(() => loadConfig({ BELLKEEP_PORT: 'eighty' })).toThrow(/BELLKEEP_PORT/);
    expect(() => loadConfig({ BELLKEEP_JWT_SECRET: 'short' })).toThrow(/BELLKEEP_JWT_SECRET: must be at least 32/);
    expect(() => loadConfig({ BELLKEEP_ADMIN_EMAIL: 'a@kestrelfen.example' })).toThrow(/both BELLKEEP_ADMIN_EMAIL and BELLKEEP_ADMIN_PASSWORD/);
  });
});
