import request from 'supertest';
import type { ApiErrorBody, LoginResponse, PasswordResetLinkDto, UserDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { inbox } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

describe('passwords: your own change, and a reset link an admin mails', () => {
  let testApp: TestApp;
  let adminToken: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    adminToken = await testApp.signIn('maren.holt@kestrelfen.example', DEMO_PASSWORD);
  });
  afterAll(() => testApp.close());

  /** A new person of the lab, made by the admin, and their first token. */
  async function newPerson(email: string, password: string): Promise<{ user: UserDto; token: string }> {
    const user = (
      await request(testApp.app)
        .post('/api/users')
        .set(bearer(adminToken))
        .send({ email, name: 'Wren Addo', password, roles: ['auditor'] })
        .expect(201)
    ).body as UserDto;
    return { user, token: await testApp.signIn(email, password) };
  }

  it('changes your own password: the wrong current one is refused by field, the new token works, every older token stops', async () => {
    const { token } = await newPerson('wren.addo@kestrelfen.example', 'reed-bed-2026');
    const otherSession = await testApp.signIn('wren.addo@kestrelfen.example', 'reed-bed-2026');
    const change = (body: object) => request(testApp.app).post('/api/auth/password').set(bearer(token)).send(body);

    const wrong = await change({ currentPassword: 'not-it-at-all', newPassword: 'heron-watch-2027' }).expect(400);
    expect((wrong.body as ApiErrorBody).error).toMatchObject({ field: 'currentPassword', message: 'The current password is not right.' });
    expect(((await change({ currentPassword: 'reed-bed-2026', newPassword: 'short' }).expect(400)).body as ApiErrorBody).error.field).toBe('newPassword');
    await change({ currentPassword: 'reed-bed-2026', newPassword: 'reed-bed-2026' }).expect(400);

    const changed = (await change({ currentPassword: 'reed-bed-2026', newPassword: 'heron-watch-2027' }).expect(200)).body as LoginResponse;
    await request(testApp.app).get('/api/auth/me').set(bearer(changed.token)).expect(200);
    await request(testApp.app).get('/api/auth/me').set(bearer(token)).expect(401);
    await request(testApp.app).get('/api/auth/me').set(bearer(otherSession)).expect(401);
    await request(testApp.app).post('/api/auth/login').send({ email: 'wren.addo@kestrelfen.example', password: 'reed-bed-2026' }).expect(401);
    await testApp.signIn('wren.addo@kestrelfen.example', 'heron-watch-2027');

    const trail = (await request(testApp.app).get('/api/audit').query({ action: 'user.password-changed' }).set(bearer(adminToken)).expect(200)).body as {
      items: { actor: string; details: object }[];
    };
    expect(trail.items[0]).toMatchObject({ actor: 'Wren Addo', details: {} });
  });

  it('mails a single-use reset link: it sets the password once, ends the sessions, and a newer link replaces an older one', async () => {
    const { user, token } = await newPerson('tove.lind@kestrelfen.example', 'fen-lantern-9');
    const mailLink = async () => {
      const sent = (await request(testApp.app).post(`/api/users/${user.id}/password-reset-link`).set(bearer(adminToken)).expect(201)).body as PasswordResetLinkDto;
      expect(sent.sentTo).toBe('tove.lind@kestrelfen.example');
      const mails = (await inbox(testApp.mailCatcher.inboxUrl)).filter((mail) => mail.subject === 'A link to set your Bellkeep password' && mail.to[0].address === sent.sentTo);
      const secret = /\/reset-password#([0-9a-f]{64})/.exec(mails[mails.length - 1].text)![1];
      return { sent, secret, text: mails[mails.length - 1].text };
    };
    const first = await mailLink();
    expect(first.text).toContain('Maren Holt has asked Bellkeep to let you set a new password.');
    expect(Date.parse(first.sent.expiresAt) - Date.now()).toBeGreaterThan(23 * 3600_000);
    // The password stays until the link is used.
    await testApp.signIn('tove.lind@kestrelfen.example', 'fen-lantern-9');

    const second = await mailLink();
    const reset = (secret: string, newPassword: string) => request(testApp.app).post('/api/auth/password-reset').send({ secret, newPassword });
    const replaced = await reset(first.secret, 'kestrel-dawn-11').expect(400);
    expect((replaced.body as ApiErrorBody).error.message).toBe('This reset link is used, replaced by a newer one, or expired: ask an admin for a new one.');
    await reset(second.secret, 'kestrel-dawn-11').expect(204);
    await reset(second.secret, 'kestrel-dawn-12').expect(400);
    await reset('0'.repeat(63), 'kestrel-dawn-12').expect(400);

    await request(testApp.app).get('/api/auth/me').set(bearer(token)).expect(401);
    await request(testApp.app).post('/api/auth/login').send({ email: 'tove.lind@kestrelfen.example', password: 'fen-lantern-9' }).expect(401);
    await testApp.signIn('tove.lind@kestrelfen.example', 'kestrel-dawn-11');

    const trail = (
      await request(testApp.app)
        .get('/api/audit')
        .query({ targetType: 'user', targetId: String(user.id) })
        .set(bearer(adminToken))
        .expect(200)
    ).body as {
      items: { action: string }[];
    };
    expect(trail.items.slice(0, 3).map((event) => event.action)).toEqual(['user.password-reset', 'user.password-reset-link-sent', 'user.password-reset-link-sent']);
    // Nothing of a secret is ever in the trail.
    expect(JSON.stringify(trail)).not.toContain(first.secret);
    expect(JSON.stringify(trail)).not.toContain(second.secret);
  });

  it('sends no link to a deactivated account, and says so', async () => {
    const { user } = await newPerson('ivo.brask@kestrelfen.example', 'salt-marsh-44');
    await request(testApp.app).patch(`/api/users/${user.id}`).set(bearer(adminToken)).send({ active: false }).expect(200);
    const refused = await request(testApp.app).post(`/api/users/${user.id}/password-reset-link`).set(bearer(adminToken)).expect(409);
    expect((refused.body as ApiErrorBody).error.message).toBe('Wren Addo is deactivated: reactivate the account before sending a reset link.');
  });
});
