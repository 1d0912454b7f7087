import request from 'supertest';
import { ROLES, type Role, type SigningKeyDto } from '@shared/api';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@seeders/data/demo-people';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Every protected route and the roles that may use it. A route whose server-side check were
 * removed or widened would fail here: each role not listed must get 403, no token must get 401.
 */
const PROTECTED_ROUTES: Array<{ method: 'get' | 'post' | 'patch' | 'put'; path: string; roles: Role[] | 'any' }> = [
  { method: 'get', path: '/api/auth/me', roles: 'any' },
  { method: 'post', path: '/api/auth/password', roles: 'any' },
  { method: 'get', path: '/api/ledger', roles: 'any' },
  { method: 'get', path: '/api/worklist', roles: 'any' },
  { method: 'get', path: '/api/users', roles: ['admin'] },
  { method: 'post', path: '/api/users', roles: ['admin'] },
  { method: 'patch', path: '/api/users/1', roles: ['admin'] },
  { method: 'post', path: '/api/users/1/password-reset-link', roles: ['admin'] },
  { method: 'get', path: '/api/profiles', roles: 'any' },
  { method: 'get', path: '/api/profiles/1', roles: 'any' },
  { method: 'post', path: '/api/profiles', roles: ['admin'] },
  { method: 'post', path: '/api/profiles/1/versions', roles: ['admin'] },
  { method: 'get', path: '/api/setups', roles: 'any' },
  { method: 'get', path: '/api/setups/1', roles: 'any' },
  { method: 'post', path: '/api/setups', roles: ['admin'] },
  { method: 'put', path: '/api/setups/1', roles: ['admin'] },
  { method: 'put', path: '/api/setups/1/column-mapping', roles: ['experimentalist', 'admin'] },
  { method: 'get', path: '/api/runs', roles: 'any' },
  { method: 'post', path: '/api/runs', roles: ['experimentalist'] },
  { method: 'get', path: '/api/runs/1', roles: 'any' },
  { method: 'get', path: '/api/runs/1/blocks', roles: 'any' },
  { method: 'get', path: '/api/runs/1/trail', roles: 'any' },
  { method: 'post', path: '/api/runs/1/sign-off', roles: ['shift-lead'] },
  // Every role gets past the guard; the uploader-or-admin rule is the service's (tests/api/withdrawals.spec.ts).
  { method: 'post', path: '/api/runs/1/withdraw', roles: 'any' },
  { method: 'get', path: '/api/runs/station-logs', roles: 'any' },
  { method: 'post', path: '/api/runs/1/realign', roles: ['shift-lead'] },
  { method: 'get', path: '/api/runs/1/verification', roles: 'any' },
  { method: 'get', path: '/api/runs/1/reverifications', roles: 'any' },
  { method: 'post', path: '/api/runs/1/reverifications', roles: ['auditor', 'admin'] },
  { method: 'get', path: '/api/runs/1/export/json', roles: 'any' },
  { method: 'get', path: '/api/runs/1/export/pdf', roles: 'any' },
  { method: 'get', path: '/api/planner?qber=0.02&winFraction=0.84&profileVersionId=1', roles: 'any' },
  { method: 'get', path: '/api/planner/prefill?setupId=1', roles: 'any' },
  // An incomplete query: the role check passes and the input is refused at once (400), unplanned.
  { method: 'get', path: '/api/planner/general-attack?qber=0.02', roles: 'any' },
  { method: 'get', path: '/api/audit', roles: ['auditor', 'admin'] },
  { method: 'get', path: '/api/audit/actors', roles: ['auditor', 'admin'] },
  { method: 'get', path: '/api/audit/trail-check', roles: ['auditor', 'admin'] },
  { method: 'get', path: '/api/audit/export.csv', roles: ['auditor', 'admin'] },
  { method: 'get', path: '/api/workers', roles: ['admin'] },
  { method: 'get', path: '/metrics', roles: ['admin'] },
];

/** One demo person holding exactly this single role. */
function personWithOnly(role: Role) {
  return DEMO_PEOPLE.find((person) => person.roles.length === 1 && person.roles[0] === role)!;
}

describe('role checks on the server', () => {
  let testApp: TestApp;
  const tokens = new Map<Role, string>();

  beforeAll(async () => {
    testApp = await createTestApp();
    for (const role of ROLES) tokens.set(role, await testApp.signIn(personWithOnly(role).email, DEMO_PASSWORD));
  });
  afterAll(() => testApp.close());

  it('publishes the signing keys to anyone, signed in or not (public keys are for checking reports)', async () => {
    const keys = (await request(testApp.app).get('/api/signing-keys').expect(200)).body as SigningKeyDto[];
    expect(keys).toHaveLength(1);
    expect(keys[0].algorithm).toBe('Ed25519');
    expect(keys[0].publicKeyPem).toContain('BEGIN PUBLIC KEY');
  });

  it.each(['/api/openapi.json', '/api/reference'])('serves %s to anyone, signed in or not (it describes the API and holds no data)', async (path) => {
    await request(testApp.app).get(path).expect(200);
    await request(testApp.app)
      .get(path)
      .set('Authorization', `Bearer ${tokens.get('auditor')}`)
      .expect(200);
  });

  describe.each(PROTECTED_ROUTES)('$method $path', ({ method, path, roles }) => {
    it('answers 401 without a token', async () => {
      await request(testApp.app)[method](path).expect(401);
    });

    it.each(ROLES)('as %s', async (role) => {
      const response = await request(testApp.app)
        [method](path)
        .set('Authorization', `Bearer ${tokens.get(role)}`)
        .send({});
      const allowed = roles === 'any' || roles.includes(role);
      // Allowed: past the role check, so an answer about the request itself (run 1 may not exist).
      if (allowed) expect([200, 201, 400, 404]).toContain(response.status);
      else expect(response.status).toBe(403);
    });
  });
});
