import request from 'supertest';
import {
  auditFilterSchema,
  auditQuerySchema,
  bookingListQuerySchema,
  ledgerQuerySchema,
  planPrefillQuerySchema,
  planQuerySchema,
  ROLES,
  runListQuerySchema,
  stationLogQuerySchema,
  type ApiErrorBody,
  type BookingDto,
  type CreatedUploadTokenDto,
  type Role,
  type RunDto,
  type SetupDto,
  type UserDto,
} from '@shared/api';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '@seeders/data/demo-people';
import { forgedToken, unsignedToken } from '../support/forged-tokens';
import { endpointKey, listEndpoints, type Endpoint } from '../support/route-list';
import { fixtureLog, uploadLog } from '../support/runs-api';
import { createTestApp, type TestApp } from '../support/test-app';

/** Routes anyone may call, each with the reason it is public. */
const PUBLIC_ROUTES: Record<string, string> = {
  'POST /api/auth/login': 'signing in is how one gets a token; limited per address (tested below)',
  'POST /api/auth/password-reset': 'a mailed link sets the password of someone who cannot sign in; it needs the link’s 256-bit secret, works once, and is limited per address',
  'GET /api/health': 'the liveness probe of the lab’s monitoring; it says "ok" and nothing else',
  'GET /api/ready': 'the readiness probe of a load balancer; it names the parts that answer or not, and nothing of the data',
  'GET /api/signing-keys': 'public keys, published so that partner labs can check exported reports',
  'GET /api/openapi.json': 'the OpenAPI document: it describes the API, and holds no data',
  'GET /api/reference': 'the page that shows the OpenAPI document',
  'GET /api/reference/:file': 'the reference page’s script, styles and font (a fixed list of files)',
  'GET /{*path}': 'index.html of the web app for its client-side routes; it holds no data',
};

/** Middleware (by mount path and function name) that answers nothing of its own but a refusal or a public file. */
const PASS_THROUGH: Record<string, string> = {
  '/ helmetMiddleware': 'sets security headers on every answer, then passes the request on',
  '/ result': 'pino-http: gives the request its id and logs it once answered, then passes the request on',
  '/ inContext': 'runs the rest of the request in its request id’s context, then passes the request on',
  '/api jsonParser': 'parses a JSON body, then passes the request on',
  '/api refuseNulCharacters': 'refuses a NUL character in the query or a JSON body (400), or passes the request on',
  '/api apiNotFound': 'the 404 of an API path that no route has',
  '/ serveStatic': 'the built web app’s own files, public like any web page',
};

/** Who may pass a route's guard: people holding one of `roles`, and an upload token if `uploadToken`. */
interface Guard {
  roles: readonly Role[];
  uploadToken?: true;
}

const SIGNED_IN: Guard = { roles: ROLES };
const ADMIN: Guard = { roles: ['admin'] };
const TRAIL_READERS: Guard = { roles: ['auditor', 'admin'] };
const TOKEN_KEEPERS: Guard = { roles: ['admin', 'shift-lead'] };
const UPLOADERS: Guard = { roles: ['experimentalist'], uploadToken: true };

/**
 * Every other route, and who may pass its guard, as read in the route files. `ALL` is a middleware
 * mounted with `use`: every method under its path passes its guard first.
 */
const GUARDED_ROUTES: Record<string, Guard> = {
  'GET /api/auth/me': SIGNED_IN,
  'POST /api/auth/password': SIGNED_IN,
  'GET /api/ledger': SIGNED_IN,
  'GET /api/worklist': SIGNED_IN,
  'ALL /api/users': ADMIN,
  'GET /api/users': ADMIN,
  'POST /api/users': ADMIN,
  'PATCH /api/users/:id': ADMIN,
  'POST /api/users/:id/password-reset-link': ADMIN,
  'GET /api/workers': ADMIN,
  'GET /metrics': ADMIN,
  'GET /api/profiles': SIGNED_IN,
  'GET /api/profiles/:id': SIGNED_IN,
  'POST /api/profiles': ADMIN,
  'POST /api/profiles/:id/versions': ADMIN,
  'GET /api/setups/:id/upload-tokens': TOKEN_KEEPERS,
  'POST /api/setups/:id/upload-tokens': TOKEN_KEEPERS,
  'POST /api/setups/:id/upload-tokens/:tokenId/revoke': TOKEN_KEEPERS,
  'GET /api/setups': SIGNED_IN,
  'GET /api/setups/:id': SIGNED_IN,
  'POST /api/setups': ADMIN,
  'PUT /api/setups/:id': ADMIN,
  'PUT /api/setups/:id/column-mapping': { roles: ['experimentalist', 'admin'] },
  'POST /api/bookings': { roles: ['experimentalist', 'shift-lead', 'admin'] },
  'GET /api/bookings': SIGNED_IN,
  'GET /api/bookings/:id': SIGNED_IN,
  'GET /api/planner': SIGNED_IN,
  'GET /api/planner/general-attack': SIGNED_IN,
  'GET /api/planner/prefill': SIGNED_IN,
  'GET /api/audit': TRAIL_READERS,
  'GET /api/audit/actors': TRAIL_READERS,
  'GET /api/audit/trail-check': TRAIL_READERS,
  'GET /api/audit/export.csv': TRAIL_READERS,
  'GET /api/runs/:id/verification': SIGNED_IN,
  'GET /api/runs/:id/reverifications': SIGNED_IN,
  'POST /api/runs/:id/reverifications': TRAIL_READERS,
  'GET /api/runs/:id/export/:format': SIGNED_IN,
  'POST /api/runs': UPLOADERS,
  'GET /api/runs': SIGNED_IN,
  'GET /api/runs/:id': SIGNED_IN,
  'GET /api/runs/:id/blocks': SIGNED_IN,
  'GET /api/runs/:id/trail': SIGNED_IN,
  'POST /api/runs/:id/sign-off': { roles: ['shift-lead'] },
  // Who may withdraw (the uploader, an admin) is the service's check: tests/api/withdrawals.spec.ts.
  'POST /api/runs/:id/withdraw': SIGNED_IN,
  'GET /api/runs/station-logs': SIGNED_IN,
  // Which shift lead (one of the run's setup) is the service's check: tests/api/station-uploads.spec.ts.
  'POST /api/runs/:id/realign': { roles: ['shift-lead'] },
  'ALL /api/uploads': UPLOADERS,
  'GET /api/uploads/:id': UPLOADERS,
};

/** The methods a middleware endpoint is probed with, the tus protocol's among them. */
const ANY_METHOD = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS'] as const;

/** One request of the probe: a method on a path whose parameters name things that exist. */
interface Probe {
  key: string;
  method: string;
  url: string;
}

interface Answer {
  probe: Probe;
  status: number;
  body: unknown;
}

/** A refusal or a fault: what a request its guard lets in must never get. */
const refusedOrFaulty = (answer: Answer) => answer.status === 401 || answer.status === 403 || answer.status >= 500;

function isPassThrough(endpoint: Endpoint): boolean {
  return endpoint.method === 'ALL' && `${endpoint.path} ${endpoint.handler}` in PASS_THROUGH;
}

/** The route's path with each `:name` filled from `parameters` (1 when not named there). */
function filledPath(path: string, parameters: Record<string, string>): string {
  return path.replace(/:(\w+)/g, (_match, name: string) => parameters[name] ?? '1');
}

/** A route: one request; a middleware: every method on its own path and on a path below it. */
function probesOf(endpoint: Endpoint, parameters: Record<string, string>): Probe[] {
  const key = endpointKey(endpoint);
  const url = filledPath(endpoint.path, parameters);
  if (endpoint.method !== 'ALL') return [{ key, method: endpoint.method, url }];
  return ANY_METHOD.flatMap((method) => [url, `${url}/1`].map((target) => ({ key, method, url: target })));
}

let testApp: TestApp;
let endpoints: Endpoint[];
const signedIn = new Map<string, string>();

/** A demo person's bearer header. */
const bearerOf = (email: string) => ({ Authorization: `Bearer ${signedIn.get(email)}` });

/** Somebody the route's guard lets in. */
const someoneAllowed = (key: string) => DEMO_PEOPLE.find((person) => GUARDED_ROUTES[key].roles.some((role) => person.roles.includes(role)))!.email;

beforeAll(async () => {
  testApp = await createTestApp();
  for (const person of DEMO_PEOPLE) signedIn.set(person.email, await testApp.signIn(person.email, DEMO_PASSWORD));
  endpoints = listEndpoints(testApp.app);
});
afterAll(() => testApp.close());

describe('every API route refuses whoever its guard does not let in', () => {
  let probes: Probe[];
  let deactivatedAdmin: string;
  let uploadToken: string;
  let runId: number;
  let bookingId: number;

  /** Answers to every probe with these headers, a few requests at a time. */
  async function answersTo(headers: Record<string, string>): Promise<Answer[]> {
    const answers: Answer[] = [];
    for (let start = 0; start < probes.length; start += 8) {
      answers.push(
        ...(await Promise.all(
          probes.slice(start, start + 8).map(async (probe) => {
            let call = request(testApp.app)[probe.method.toLowerCase() as 'get'](probe.url).set(headers);
            if (['POST', 'PUT', 'PATCH'].includes(probe.method)) call = call.send({});
            const response = await call;
            return { probe, status: response.status, body: response.body as unknown };
          }),
        )),
      );
    }
    return answers;
  }

  const described = ({ probe, status, body }: Answer) => `${probe.method} ${probe.url} (${probe.key}) → ${status} ${JSON.stringify(body).slice(0, 120)}`;

  beforeAll(async () => {
    const admin = bearerOf('maren.holt@kestrelfen.example');

    // An admin who signed in, then was deactivated: the token is well made and unexpired.
    const former = (
      await request(testApp.app)
        .post('/api/users')
        .set(admin)
        .send({ email: 'former.admin@kestrelfen.example', name: 'Former Admin', password: 'long-gone-2026', roles: ['admin'] })
        .expect(201)
    ).body as UserDto;
    deactivatedAdmin = await testApp.signIn('former.admin@kestrelfen.example', 'long-gone-2026');
    await request(testApp.app).patch(`/api/users/${former.id}`).set(admin).send({ active: false }).expect(200);

    // Run 1 and booking 1 on setup 1, so that `:id` = 1 names something on every route.
    const dev = signedIn.get('dev.okafor@kestrelfen.example')!;
    runId = ((await uploadLog(testApp.app, dev, fixtureLog('accepted-run.csv'), { setupId: 1 }).expect(201)).body as RunDto).id;
    const now = Date.now();
    const booking = await request(testApp.app)
      .post('/api/bookings')
      .set({ Authorization: `Bearer ${dev}` })
      .send({ setupId: 1, night: '2026-12-04', windowStart: new Date(now + 60_000).toISOString(), windowEnd: new Date(now + 36_000_000).toISOString(), plannedRounds: 4000 })
      .expect(201);
    bookingId = (booking.body as BookingDto).id;

    // Two upload tokens of setup 1: one the revoke route names (an allowed admin revokes it), one to send.
    const newToken = async (name: string) =>
      (await request(testApp.app).post('/api/setups/1/upload-tokens').set(admin).send({ name, validDays: 1 }).expect(201)).body as CreatedUploadTokenDto;
    const revoked = await newToken('named by the revoke route');
    uploadToken = (await newToken('acquisition computer')).token;

    const guarded = endpoints.filter((endpoint) => endpointKey(endpoint) in GUARDED_ROUTES);
    const unique = guarded.filter((endpoint, index) => guarded.findIndex((other) => endpointKey(other) === endpointKey(endpoint)) === index);
    probes = unique.flatMap((endpoint) => probesOf(endpoint, { tokenId: String(revoked.id), format: 'json' }));
  });

  it('finds every route of the router in one of the tables, and every table entry among the routes', () => {
    const listed = endpoints.filter((endpoint) => !isPassThrough(endpoint));
    const keys = new Set(listed.map(endpointKey));
    const unlisted = listed.filter((endpoint) => !(endpointKey(endpoint) in PUBLIC_ROUTES) && !(endpointKey(endpoint) in GUARDED_ROUTES));
    expect(unlisted.map((endpoint) => `${endpointKey(endpoint)} ${endpoint.handler}`.trim())).toEqual([]);
    const middleware = new Set(endpoints.filter(isPassThrough).map((endpoint) => `${endpoint.path} ${endpoint.handler}`));
    const stale = [...Object.keys(PUBLIC_ROUTES), ...Object.keys(GUARDED_ROUTES)].filter((key) => !keys.has(key));
    expect([...stale, ...Object.keys(PASS_THROUGH).filter((key) => !middleware.has(key))]).toEqual([]);
  });

  it('probes with parameters that exist: run, booking, setup, profile and user 1', async () => {
    expect([runId, bookingId]).toEqual([1, 1]);
    const admin = bearerOf('maren.holt@kestrelfen.example');
    for (const url of ['/api/setups/1', '/api/profiles/1', '/api/runs/1', '/api/bookings/1']) await request(testApp.app).get(url).set(admin).expect(200);
    const users = (await request(testApp.app).get('/api/users').set(admin).expect(200)).body as UserDto[];
    expect(users.map((user) => user.id)).toContain(1);
  });

  it('answers the public API routes without a token', async () => {
    await request(testApp.app).get('/api/health').expect(200);
    await request(testApp.app).get('/api/signing-keys').expect(200);
    await request(testApp.app).get('/api/openapi.json').expect(200);
    await request(testApp.app).get('/api/reference').expect(200);
    await request(testApp.app).post('/api/auth/login').send({ email: 'sami.virtanen@kestrelfen.example', password: DEMO_PASSWORD }).expect(200);
  });

  /** Credentials that name nobody, or somebody no longer there; each is tried as the admin (user 1) where it names a user. */
  const badCredentials: Array<[string, () => Record<string, string>]> = [
    ['no token', () => ({})],
    ['an unsigned token (alg: none)', () => ({ Authorization: `Bearer ${unsignedToken('1')}` })],
    ['an expired token', () => ({ Authorization: `Bearer ${forgedToken({ subject: '1', expiresIn: -60 })}` })],
    ['a token signed with another secret', () => ({ Authorization: `Bearer ${forgedToken({ subject: '1', secret: 'another-secret-that-is-long-enough-too' })}` })],
    ['a token of another issuer', () => ({ Authorization: `Bearer ${forgedToken({ subject: '1', issuer: 'not-bellkeep' })}` })],
    ['a token of an unknown user', () => ({ Authorization: `Bearer ${forgedToken({ subject: '999999' })}` })],
    ['a token of a deactivated admin', () => ({ Authorization: `Bearer ${deactivatedAdmin}` })],
    ['a bearer that is not a token', () => ({ Authorization: 'Bearer not.a.token' })],
  ];

  it.each(badCredentials)('refuses %s with 401 on every guarded route', async (_name, headers) => {
    const answers = await answersTo(headers());
    expect(answers.filter((answer) => answer.status !== 401).map(described)).toEqual([]);
  });

  it.each(DEMO_PEOPLE.map((person) => [person.email, person.roles] as const))(
    'lets %s (%j) in where one of the roles may, and refuses with 403 elsewhere',
    async (email, roles) => {
      const answers = await answersTo(bearerOf(email));
      const mayPass = (answer: Answer) => GUARDED_ROUTES[answer.probe.key].roles.some((role) => roles.includes(role));
      expect(answers.filter((answer) => !mayPass(answer) && answer.status !== 403).map(described)).toEqual([]);
      // Let in: an answer about the request itself (400, 404, 409 …), never a refusal or a fault.
      expect(answers.filter((answer) => mayPass(answer) && refusedOrFaulty(answer)).map(described)).toEqual([]);
    },
  );

  it('refuses an upload token with 401 everywhere but the upload routes, and lets it in there', async () => {
    const answers = await answersTo({ Authorization: `Bearer ${uploadToken}` });
    const uploads = (answer: Answer) => GUARDED_ROUTES[answer.probe.key].uploadToken === true;
    expect(answers.filter(uploads).length).toBeGreaterThan(0);
    expect(answers.filter((answer) => !uploads(answer) && answer.status !== 401).map(described)).toEqual([]);
    expect(answers.filter((answer) => uploads(answer) && refusedOrFaulty(answer)).map(described)).toEqual([]);
  });
});

/** The planner's query (both plans read it); `base` is a valid plan, so each parameter is refused on its own. */
const PLAN_QUERY = {
  parameters: Object.keys(planQuerySchema.shape),
  base: { qber: '0.02', winFraction: '0.84', profileVersionId: '1' },
};

/** The query parameters of each route that reads its query string, from its contract in shared/api; `base` makes the rest valid. */
const QUERY_PARAMETERS: Record<string, { parameters: readonly string[]; base?: Record<string, string> }> = {
  'GET /api/runs': { parameters: Object.keys(runListQuerySchema.shape) },
  'GET /api/runs/station-logs': { parameters: Object.keys(stationLogQuerySchema.shape) },
  'GET /api/audit': { parameters: Object.keys(auditQuerySchema.shape) },
  'GET /api/audit/export.csv': { parameters: Object.keys(auditFilterSchema.shape) },
  'GET /api/bookings': { parameters: Object.keys(bookingListQuerySchema.shape) },
  'GET /api/ledger': { parameters: Object.keys(ledgerQuerySchema.shape) },
  'GET /api/planner': PLAN_QUERY,
  'GET /api/planner/general-attack': PLAN_QUERY,
  'GET /api/planner/prefill': { parameters: Object.keys(planPrefillQuerySchema.shape) },
};

/** SQL's quotes, comment, LIKE wildcards and escape, injections, text outside ASCII, and values far too long. */
const HOSTILE_VALUES: readonly string[] = [
  "'",
  '"',
  ';--',
  '%',
  '_',
  '\\',
  "' OR 1=1 --",
  "1' OR '1'='1",
  '1; DROP TABLE runs; --',
  "\\'; SELECT pg_sleep(5); --",
  'Kestrel Fen Ω 量子 🔔',
  '\u0000',
  '\u202e1',
  '1'.repeat(400),
  "'".repeat(3000),
  'ℵ'.repeat(1000),
];

describe('hostile query strings and bodies', () => {
  /** The answer to a query as someone the route lets in. */
  function queried(key: string, query: URLSearchParams) {
    return request(testApp.app)
      .get(`${key.replace(/^GET /, '')}?${query}`)
      .set(bearerOf(someoneAllowed(key)));
  }

  it('lists every GET route that refuses a query parameter it does not know', async () => {
    const readers: string[] = [];
    for (const endpoint of endpoints.filter((candidate) => candidate.method === 'GET' && endpointKey(candidate) in GUARDED_ROUTES)) {
      const key = endpointKey(endpoint);
      const response = await request(testApp.app)
        .get(`${filledPath(endpoint.path, { format: 'json' })}?bellkeepProbe=1`)
        .set(bearerOf(someoneAllowed(key)));
      if (response.status === 400) readers.push(key);
    }
    expect(readers.sort()).toEqual(Object.keys(QUERY_PARAMETERS).sort());
  });

  it.each(Object.entries(QUERY_PARAMETERS))('%s answers 200, or 400 naming the parameter, never a fault', async (key, { parameters, base = {} }) => {
    const unexpected: string[] = [];
    for (const parameter of parameters) {
      const queries = HOSTILE_VALUES.map((value) => new URLSearchParams({ ...base, [parameter]: value }));
      // The parameter twice: the query parser makes it an array.
      queries.push(new URLSearchParams([...Object.entries({ ...base, [parameter]: '1' }), [parameter, '2']]));
      const answers = await Promise.all(queries.map(async (query) => ({ query, response: await queried(key, query) })));
      for (const { query, response } of answers) {
        const field = (response.body as Partial<ApiErrorBody>).error?.field;
        if (response.status !== 200 && !(response.status === 400 && field === parameter)) {
          unexpected.push(`${parameter}=${query.getAll(parameter).join('&').slice(0, 40)} → ${response.status} ${JSON.stringify(response.body).slice(0, 160)}`);
        }
      }
    }
    expect(unexpected).toEqual([]);
  });

  it('refuses a NUL character in a JSON body with 400 naming the field (PostgreSQL stores none)', async () => {
    const admin = bearerOf('maren.holt@kestrelfen.example');
    const setup = (await request(testApp.app).get('/api/setups/1').set(admin).expect(200)).body as SetupDto;
    const saved = {
      name: setup.name,
      description: setup.description,
      stationALabel: setup.stationALabel,
      stationBLabel: setup.stationBLabel,
      defaultProfileId: setup.defaultProfileId,
      shiftLeadIds: setup.shiftLeads.map((lead) => lead.id),
      extraRecipients: setup.extraRecipients,
    };
    const refused = await request(testApp.app)
      .put('/api/setups/1')
      .set(admin)
      .send({ ...saved, description: `${setup.description}\u0000` })
      .expect(400);
    expect((refused.body as ApiErrorBody).error.field).toBe('description');
    await request(testApp.app).put('/api/setups/1').set(admin).send(saved).expect(200);
  });
});

describe('the sign-in limit per client address', () => {
  const LIMIT = 5;
  let limited: TestApp;

  beforeAll(async () => {
    limited = await createTestApp({ BELLKEEP_LOGIN_LIMIT: String(LIMIT), BELLKEEP_LOGIN_ACCOUNT_LIMIT: '1000' });
  });
  afterAll(() => limited.close());

  /** A sign-in as dev.okafor from `address`, as the lab's reverse proxy (on the loopback) forwards it. */
  function signInFrom(forwardedFor: string, password: string) {
    return request(limited.app).post('/api/auth/login').set('X-Forwarded-For', forwardedFor).send({ email: 'dev.okafor@kestrelfen.example', password });
  }

  it('refuses the attempt after the limit with 429, even with the right password, and says the policy', async () => {
    for (let attempt = 0; attempt < LIMIT; attempt += 1) await signInFrom('203.0.113.10', 'wrong-password').expect(401);
    const refused = await signInFrom('203.0.113.10', DEMO_PASSWORD).expect(429);
    expect((refused.body as ApiErrorBody).error.code).toBe('rate-limited');
    expect((refused.body as ApiErrorBody).error.message).toMatch(/^Too many sign-in attempts from this address; try again in 15 minutes \(at \d\d:\d\d UTC\)\.$/);
    expect(refused.headers['ratelimit-policy']).toContain(`q=${LIMIT}`);
  });

  it('counts each address on its own', async () => {
    for (let attempt = 0; attempt < LIMIT; attempt += 1) await signInFrom('203.0.113.20', 'wrong-password').expect(401);
    await signInFrom('203.0.113.20', DEMO_PASSWORD).expect(429);
    await signInFrom('203.0.113.21', DEMO_PASSWORD).expect(200);
  });

  it('counts by the address the proxy saw, whatever the client wrote in front of it in X-Forwarded-For', async () => {
    for (let attempt = 0; attempt < LIMIT; attempt += 1) await signInFrom(`198.51.100.${attempt}, 203.0.113.30`, 'wrong-password').expect(401);
    await signInFrom('198.51.100.99, 203.0.113.30', DEMO_PASSWORD).expect(429);
  });

  it('counts the IPv6 addresses of one /56 network as one client', async () => {
    for (let attempt = 0; attempt < LIMIT; attempt += 1) await signInFrom(`2001:db8:0:${attempt}::1`, 'wrong-password').expect(401);
    await signInFrom('2001:db8:0:ff::7', DEMO_PASSWORD).expect(429);
    await signInFrom('2001:db8:0:100::1', DEMO_PASSWORD).expect(200);
  });
});

describe('the sign-in limit per account', () => {
  const LIMIT = 4;
  let limited: TestApp;

  beforeAll(async () => {
    limited = await createTestApp({ BELLKEEP_LOGIN_LIMIT: '1000', BELLKEEP_LOGIN_ACCOUNT_LIMIT: String(LIMIT) });
  });
  afterAll(() => limited.close());

  function signInAs(email: string, password: string, forwardedFor: string) {
    return request(limited.app).post('/api/auth/login').set('X-Forwarded-For', forwardedFor).send({ email, password });
  }

  it('refuses an account after its failed sign-ins from many addresses, even with the right password, and says when to try again', async () => {
    for (let attempt = 0; attempt < LIMIT; attempt += 1) await signInAs('dev.okafor@kestrelfen.example', 'wrong-password', `198.51.100.${attempt + 1}`).expect(401);
    const refused = await signInAs('Dev.Okafor@kestrelfen.example ', DEMO_PASSWORD, '203.0.113.77').expect(429);
    expect((refused.body as ApiErrorBody).error.message).toMatch(/^Too many failed sign-ins for this account; try again in 15 minutes \(at \d\d:\d\d UTC\), or ask an admin\.$/);
  });

  it('counts only failed sign-ins, and each account on its own', async () => {
    for (let attempt = 0; attempt < LIMIT * 2; attempt += 1) await signInAs('sami.virtanen@kestrelfen.example', DEMO_PASSWORD, '203.0.113.78').expect(200);
    for (let attempt = 0; attempt < LIMIT - 1; attempt += 1) await signInAs('lucia.brandt@kestrelfen.example', 'wrong-password', '203.0.113.79').expect(401);
    await signInAs('lucia.brandt@kestrelfen.example', DEMO_PASSWORD, '203.0.113.79').expect(200);
  });
});
