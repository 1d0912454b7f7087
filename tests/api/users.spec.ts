import request from 'supertest';
import type { ApiErrorBody, UserDto } from '@shared/api';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@seeders/data/demo-people';
import { createTestApp, type TestApp } from '../support/test-app';

interface CaughtMail {
  subject: string;
  text: string;
  to: Array<{ address: string }>;
}

describe('user management (admin)', () => {
  let testApp: TestApp;
  let adminToken: string;
  const asAdmin = () => ({ Authorization: `Bearer ${adminToken}` });

  beforeAll(async () => {
    testApp = await createTestApp();
    adminToken = await testApp.signIn('maren.holt@kestrelfen.example', DEMO_PASSWORD);
  });
  afterAll(() => testApp.close());

  it('lists every user without password hashes', async () => {
    const response = await request(testApp.app).get('/api/users').set(asAdmin()).expect(200);
    const users = response.body as UserDto[];
    expect(users.map((user) => user.email).sort()).toEqual(DEMO_PEOPLE.map((person) => person.email).sort());
    expect(JSON.stringify(users)).not.toMatch(/password|\$2[aby]\$/i);
  });

  it('creates a user who can then sign in, and mails them a welcome', async () => {
    const created = await request(testApp.app)
      .post('/api/users')
      .set(asAdmin())
      .send({ email: 'Noor.Fell@kestrelfen.example', name: 'Noor Fell', password: 'mill-lane-night', roles: ['experimentalist', 'auditor'] })
      .expect(201);
    expect(created.body).toMatchObject({ email: 'noor.fell@kestrelfen.example', roles: ['experimentalist', 'auditor'], active: true });
    await testApp.signIn('noor.fell@kestrelfen.example', 'mill-lane-night');

    await testApp.appMail.settled();
    const inbox = (await (await fetch(`${testApp.mailCatcher.inboxUrl}/api/email`)).json()) as CaughtMail[];
    const welcome = inbox.find((mail) => mail.to.some((to) => to.address === 'noor.fell@kestrelfen.example'));
    expect(welcome?.subject).toBe('Your Bellkeep account is ready');
    expect(welcome?.text).toContain('Maren Holt has made you a Bellkeep account with the roles: Experimentalist, Auditor.');
    expect(welcome?.text).not.toContain('mill-lane-night');
  });

  it('refuses a second user with the same e-mail in another case (409)', async () => {
    const response = await request(testApp.app)
      .post('/api/users')
      .set(asAdmin())
      .send({ email: 'DEV.OKAFOR@kestrelfen.example', name: 'Dev Again', password: 'long-enough-pw', roles: ['auditor'] })
      .expect(409);
    expect((response.body as ApiErrorBody).error).toMatchObject({ code: 'conflict', field: 'email' });
  });

  it.each([
    [{ email: 'not-an-address', name: 'X', password: 'long-enough-pw', roles: ['auditor'] }, 'email'],
    [{ email: 'a@kestrelfen.example', name: '  ', password: 'long-enough-pw', roles: ['auditor'] }, 'name'],
    [{ email: 'a@kestrelfen.example', name: 'A', password: 'short', roles: ['auditor'] }, 'password'],
    [{ email: 'a@kestrelfen.example', name: 'A', password: 'long-enough-pw', roles: [] }, 'roles'],
    [{ email: 'a@kestrelfen.example', name: 'A', password: 'long-enough-pw', roles: ['auditor', 'wizard'] }, 'roles.1'],
    [{ email: 'a@kestrelfen.example', name: 'A', password: 'long-enough-pw', roles: ['auditor'], active: false }, ''],
  ])('answers 400 naming the bad field of %j', async (body, field) => {
    const response = await request(testApp.app).post('/api/users').set(asAdmin()).send(body).expect(400);
    const error = (response.body as ApiErrorBody).error;
    expect(error.code).toBe('validation');
    if (field) expect(error.field).toBe(field);
    else expect(error.message).toMatch(/active/);
  });

  it('changes roles, and the new roles take effect on the next request', async () => {
    const lucia = await userByEmail('lucia.brandt@kestrelfen.example');
    const luciaToken = await testApp.signIn(lucia.email, DEMO_PASSWORD);
    await request(testApp.app).get('/api/users').set('Authorization', `Bearer ${luciaToken}`).expect(403);

    const changed = await request(testApp.app)
      .patch(`/api/users/${lucia.id}`)
      .set(asAdmin())
      .send({ roles: ['shift-lead', 'admin'] })
      .expect(200);
    expect((changed.body as UserDto).roles).toEqual(['shift-lead', 'admin']);
    await request(testApp.app).get('/api/users').set('Authorization', `Bearer ${luciaToken}`).expect(200);

    // The trail names the person and keeps what changed, field by field.
    const trail = (
      await request(testApp.app)
        .get('/api/audit')
        .query({ action: 'user.changed', targetId: String(lucia.id) })
        .set(asAdmin())
        .expect(200)
    ).body as {
      items: { targetName: string | null; details: Record<string, unknown> }[];
    };
    expect(trail.items[0]).toMatchObject({ targetName: 'Lucia Brandt', details: { changes: { roles: { from: ['shift-lead'], to: ['shift-lead', 'admin'] } } } });
  });

  it("changes a person's name and e-mail (signing in with the new address), and refuses an e-mail another person has", async () => {
    const ada = await userByEmail('ada.reyes@kestrelfen.example');
    const changed = await request(testApp.app).patch(`/api/users/${ada.id}`).set(asAdmin()).send({ name: 'Ada Reyes-Lind', email: ' Ada.Lind@KestrelFen.example ' }).expect(200);
    expect(changed.body as UserDto).toMatchObject({ id: ada.id, name: 'Ada Reyes-Lind', email: 'ada.lind@kestrelfen.example' });
    await testApp.signIn('ada.lind@kestrelfen.example', DEMO_PASSWORD);
    await request(testApp.app).post('/api/auth/login').send({ email: 'ada.reyes@kestrelfen.example', password: DEMO_PASSWORD }).expect(401);

    const taken = await request(testApp.app).patch(`/api/users/${ada.id}`).set(asAdmin()).send({ email: 'lucia.brandt@kestrelfen.example' }).expect(409);
    expect((taken.body as ApiErrorBody).error).toMatchObject({ code: 'conflict', field: 'email' });
    await request(testApp.app).patch(`/api/users/${ada.id}`).set(asAdmin()).send({ email: 'not an address' }).expect(400);
    await request(testApp.app).patch(`/api/users/${ada.id}`).set(asAdmin()).send({ email: 'ada.reyes@kestrelfen.example', name: 'Ada Reyes' }).expect(200);
  });

  it('deactivating a user stops their token at once and refuses their sign-in; reactivating restores it', async () => {
    const sami = await userByEmail('sami.virtanen@kestrelfen.example');
    const samiToken = await testApp.signIn(sami.email, DEMO_PASSWORD);
    await request(testApp.app).get('/api/auth/me').set('Authorization', `Bearer ${samiToken}`).expect(200);

    await request(testApp.app).patch(`/api/users/${sami.id}`).set(asAdmin()).send({ active: false }).expect(200);
    await request(testApp.app).get('/api/auth/me').set('Authorization', `Bearer ${samiToken}`).expect(401);
    await request(testApp.app).post('/api/auth/login').send({ email: sami.email, password: DEMO_PASSWORD }).expect(401);

    await request(testApp.app).patch(`/api/users/${sami.id}`).set(asAdmin()).send({ active: true }).expect(200);
    await request(testApp.app).get('/api/auth/me').set('Authorization', `Bearer ${samiToken}`).expect(200);
  });

  it('an admin cannot lock themselves out', async () => {
    const maren = await userByEmail('maren.holt@kestrelfen.example');
    await request(testApp.app).patch(`/api/users/${maren.id}`).set(asAdmin()).send({ active: false }).expect(409);
    await request(testApp.app)
      .patch(`/api/users/${maren.id}`)
      .set(asAdmin())
      .send({ roles: ['auditor'] })
      .expect(409);
  });

  it('answers 404 for an unknown user, 400 for a bad id or an empty change', async () => {
    await request(testApp.app).patch('/api/users/999999').set(asAdmin()).send({ active: false }).expect(404);
    await request(testApp.app).patch('/api/users/abc').set(asAdmin()).send({ active: false }).expect(400);
    await request(testApp.app).patch('/api/users/1').set(asAdmin()).send({}).expect(400);
  });

  async function userByEmail(email: string): Promise<UserDto> {
    const response = await request(testApp.app).get('/api/users').set(asAdmin()).expect(200);
    return (response.body as UserDto[]).find((user) => user.email === email)!;
  }
});
