import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { LAB_OPERATIONS } from './lab-operations';
import { registerOperation } from './operation';
import { PEOPLE_OPERATIONS } from './people-operations';
import { RUNS_OPERATIONS } from './runs-operations';
import { SYSTEM_OPERATIONS } from './system-operations';

/** The contract's version: raised with a change that a client must follow. */
const API_VERSION = '1.0.0';

export const API_OPERATIONS = [...PEOPLE_OPERATIONS, ...LAB_OPERATIONS, ...RUNS_OPERATIONS, ...SYSTEM_OPERATIONS];

const AUTHENTICATION = `**Signing in.** \`POST /api/auth/login\` answers a JWT (HS256, issuer \`bellkeep\`, valid \`BELLKEEP_TOKEN_TTL_SECONDS\`); send it as \`Authorization: Bearer <token>\`. Each operation names the roles that may call it (admin, experimentalist, shift-lead, auditor; a person may hold several); a deactivated person's token stops working at once.

**Upload tokens.** The acquisition computer of a booked night uploads with an upload token instead (\`bkup_\` + 32 random bytes, base64url; per setup, expiring, revocable), made at \`POST /api/setups/{id}/upload-tokens\`. Only the upload routes (\`POST /api/runs\`, \`/api/uploads\`) take one.

**Errors** are always \`{"error": {"code", "message", "field"?}}\` (\`ApiErrorBody\`).`;

/**
 * The OpenAPI 3.1 document of the API, generated from the contracts of shared/api (the same zod
 * schemas the server validates with) and the operation tables beside this file.
 */
export function buildApiDocument() {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'signIn', { type: 'http', scheme: 'bearer', bearerFormat: 'JWT', description: 'The token of `POST /api/auth/login`.' });
  registry.registerComponent('securitySchemes', 'uploadToken', {
    type: 'http',
    scheme: 'bearer',
    description: 'An upload token of a setup (`bkup_…`), for the upload routes only.',
  });
  for (const operation of API_OPERATIONS) registerOperation(registry, operation);
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: { title: 'Bellkeep API', version: API_VERSION, description: AUTHENTICATION },
  });
}
