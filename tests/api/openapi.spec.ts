import request from 'supertest';
import { API_DOCUMENT, documentedOperations, endpointAnswers } from '../support/api-contract';
import { endpointKey, listEndpoints, type Endpoint } from '../support/route-list';
import { createTestApp, type TestApp } from '../support/test-app';

/** Endpoints that are not operations of the API: middleware of every request, and the web app's own pages. */
const NOT_OPERATIONS = (endpoint: Endpoint) => (endpoint.method === 'ALL' && ['/', '/api'].includes(endpoint.path)) || endpointKey(endpoint) === 'GET /{*path}';

describe('the OpenAPI document', () => {
  let testApp: TestApp;
  let endpoints: Endpoint[];

  beforeAll(async () => {
    testApp = await createTestApp();
    endpoints = listEndpoints(testApp.app).filter((endpoint) => !NOT_OPERATIONS(endpoint));
  });
  afterAll(() => testApp.close());

  it('is OpenAPI 3.1 with both kinds of bearer token and a schema for every error', () => {
    expect(API_DOCUMENT.openapi).toBe('3.1.0');
    expect(Object.keys(API_DOCUMENT.components?.securitySchemes ?? {}).sort()).toEqual(['signIn', 'uploadToken']);
    expect(API_DOCUMENT.components?.schemas?.['ApiErrorBody']).toBeDefined();
  });

  it('documents every route the app mounts', () => {
    const operations = documentedOperations();
    const undocumented = endpoints.filter((endpoint) => !operations.some((operation) => endpointAnswers(endpoint, operation)));
    expect(undocumented.map(endpointKey)).toEqual([]);
  });

  it('documents no operation the app does not answer', () => {
    const unanswered = documentedOperations().filter((operation) => !endpoints.some((endpoint) => endpointAnswers(endpoint, operation)));
    expect(unanswered).toEqual([]);
  });

  it('says who may call each operation: public ones need no token, the others name theirs', () => {
    const operations = Object.values(API_DOCUMENT.paths ?? {}).flatMap((item) =>
      Object.values(item as Record<string, { security: unknown[]; 'x-bellkeep-access': unknown; description: string }>),
    );
    expect(operations.length).toBe(documentedOperations().length);
    for (const operation of operations) {
      expect(operation.security).toEqual(operation['x-bellkeep-access'] === 'public' ? [] : expect.arrayContaining([{ signIn: [] }]));
      expect(operation.description).toMatch(/Public: no sign-in\.|Anyone signed in|Roles: |upload token/);
    }
  });

  it('is served at /api/openapi.json without a token', async () => {
    const response = await request(testApp.app).get('/api/openapi.json').expect(200).expect('Content-Type', /json/);
    expect(response.body).toEqual(JSON.parse(JSON.stringify(API_DOCUMENT)));
  });

  it('is browsable at /api/reference, every file of the page served by the app under its content policy', async () => {
    const page = await request(testApp.app).get('/api/reference').expect(200).expect('Content-Type', /html/);
    expect(page.headers['content-security-policy']).toContain("script-src 'self'");
    // No inline script: the policy would block it.
    expect(page.text).not.toMatch(/<script>(?!<\/script>)/);
    const files = [...page.text.matchAll(/(?:src|href)="(\/api\/reference\/[^"]+)"/g)].map((match) => match[1]);
    expect(files.sort()).toEqual(['/api/reference/page.css', '/api/reference/start.js', '/api/reference/swagger-ui-bundle.js', '/api/reference/swagger-ui.css']);
    for (const file of files) await request(testApp.app).get(file).expect(200);
    const style = await request(testApp.app).get('/api/reference/page.css').expect(200);
    const fonts = [...style.text.matchAll(/url\('([^']+)'\)/g)].map((match) => match[1]);
    expect(fonts).toHaveLength(2);
    for (const font of fonts)
      await request(testApp.app)
        .get(font)
        .expect(200)
        .expect('Content-Type', /font\/woff2/);
    const script = await request(testApp.app).get('/api/reference/start.js').expect(200);
    expect(script.text).toContain("url: '/api/openapi.json'");
    await request(testApp.app).get('/api/reference/index.html').expect(404);
  });
});
