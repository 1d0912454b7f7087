import jwt from 'jsonwebtoken';
import request from 'supertest';
import type { ApiErrorBody, LoginResponse, UserDto } from '@shared/api';
import { DEMO_PASSWORD } from '@seeders/data/demo-people';
import { createTestApp, TEST_JWT_SECRET, type TestApp } from '../support/test-app';

const ADMIN = 'maren.holt@kestrelfen.example';
const SECRET = TEST_JWT_SECRET;

describe('sign-in', () => {
  let testApp: TestApp;
  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(() => testApp.close());

  it('answers a token and the user for the right password, and /me knows the user', async () => {
    const response = await request(testApp.app).post('/api/auth/login').send({ email: ADMIN, password: DEMO_PASSWORD }).expect(200);
    const body = response.body as LoginResponse;
    expect(body.user).toMatchObject({ email: ADMIN, name: 'Maren Holt', roles: ['admin'], active: true });
    expect(body.user).not.toHaveProperty('passwordHash');
    expect(new Date(body.expiresAt).getTime()).toBeGreaterThan(Date.now());

    const me = await request(testApp.app).get('/api/auth/me').set('Authorization', `Bearer ${body.token}`).expect(200);
    expect((me.body as UserDto).email).toBe(ADMIN);
  });

  it('accepts the e-mail in any case', async () => {
    await request(testApp.app).post('/api/auth/login').send({ email: ADMIN.toUpperCase(), password: DEMO_PASSWORD }).expect(200);
  });

  it('refuses a wrong password and an unknown e-mail alike, with the JSON error shape', async () => {
    const wrong = await request(testApp.app).post('/api/auth/login').send({ email: ADMIN, password: 'not-the-password' }).expect(401);
    const unknown = await request(testApp.app).post('/api/auth/login').send({ email: 'nobody@kestrelfen.example', password: 'x' }).expect(401);
    expect((wrong.body as ApiErrorBody).error.code).toBe('unauthorized');
    expect(unknown.body).toEqual(wrong.body);
  });

  it('names the missing field of a bad body', async () => {
    const response = await request(testApp.app).post('/api/auth/login').send({ email: ADMIN }).expect(400);
    expect((response.body as ApiErrorBody).error).toMatchObject({ code: 'validation', field: 'password' });
  });

  it('says when the body is not JSON at all', async () => {
    const response = await request(testApp.app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email":').expect(400);
    expect((response.body as ApiErrorBody).error.message).toMatch(/not valid JSON/);
  });

  describe('refuses tokens that are not good', () => {
    const adminId = async () => (await testApp.database.models.User.findOne({ where: { email: ADMIN } }))!.id;
    const meWith = (token: string) => request(testApp.app).get('/api/auth/me').set('Authorization', `Bearer ${token}`);

    it('no token', async () => {
      await request(testApp.app).get('/api/auth/me').expect(401);
    });
    it('an expired token', async () => {
      const token = jwt.sign({ exp: Math.floor(Date.now() / 1000) - 10 }, SECRET, { issuer: 'bellkeep', subject: String(await adminId()) });
      await meWith(token).expect(401);
    });
    it('a token signed with another secret', async () => {
      const token = jwt.sign({}, 'another-secret-another-secret-another', { issuer: 'bellkeep', subject: String(await adminId()), expiresIn: 60 });
      await meWith(token).expect(401);
    });
    it('an unsigned token (alg none)', async () => {
      const token = jwt.sign({}, '', { algorithm: 'none', issuer: 'bellkeep', subject: String(await adminId()), expiresIn: 60 });
      await meWith(token).expect(401);
    });
    it('a token of another issuer', async () => {
      const token = jwt.sign({}, SECRET, { issuer: 'elsewhere', subject: String(await adminId()), expiresIn: 60 });
      await meWith(token).expect(401);
    });
  });

  it('security headers from helmet are on', async () => {
    const response = await request(testApp.app).get('/api/health').expect(200);
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['content-security-policy']).toContain("default-src 'self'");
    expect(response.headers['x-powered-by']).toBeUndefined();
  });

  it('unknown API routes answer 404 in the JSON shape', async () => {
    const response = await request(testApp.app).get('/api/nothing-here').expect(404);
    expect((response.body as ApiErrorBody).error.code).toBe('not-found');
  });
});

describe('sign-in rate limit', () => {
  let testApp: TestApp;
  beforeAll(async () => {
    testApp = await createTestApp({ BELLKEEP_LOGIN_LIMIT: '3' });
  });
  afterAll(() => testApp.close());

  it('answers 429 once the attempts of the window are used up, even with the right password', async () => {
    for (let attempt = 0; attempt < 3; attempt += 1) {
      await request(testApp.app).post('/api/auth/login').send({ email: ADMIN, password: 'wrong-password' }).expect(401);
    }
    const limited = await request(testApp.app).post('/api/auth/login').send({ email: ADMIN, password: DEMO_PASSWORD }).expect(429);
    expect((limited.body as ApiErrorBody).error.code).toBe('rate-limited');
  });
});
