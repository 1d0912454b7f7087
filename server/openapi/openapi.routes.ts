import path from 'node:path';
import { Router } from 'express';
import { HttpError } from '../http/http-error';
import { buildApiDocument } from './api-document';
import { REFERENCE_CSS, REFERENCE_HTML, REFERENCE_SCRIPT } from './reference-page';

const packageFile = (name: string, ...parts: string[]) => path.join(path.dirname(require.resolve(`${name}/package.json`)), ...parts);

/** The reference page's files by name: Swagger UI's from its package, the font from the app's, and our own two. */
const REFERENCE_FILES: Record<string, { file: string } | { type: string; text: string }> = {
  'swagger-ui.css': { file: packageFile('swagger-ui-dist', 'swagger-ui.css') },
  'swagger-ui-bundle.js': { file: packageFile('swagger-ui-dist', 'swagger-ui-bundle.js') },
  'roboto-latin-400-normal.woff2': { file: packageFile('@fontsource/roboto', 'files', 'roboto-latin-400-normal.woff2') },
  'roboto-latin-700-normal.woff2': { file: packageFile('@fontsource/roboto', 'files', 'roboto-latin-700-normal.woff2') },
  'start.js': { type: 'js', text: REFERENCE_SCRIPT },
  'page.css': { type: 'css', text: REFERENCE_CSS },
};

/**
 * `GET /api/openapi.json`: the API's OpenAPI 3.1 document; `GET /api/reference`: a page to browse
 * it, with its files under `/api/reference/{file}`. All public, like /api/health: they describe
 * the API and hold no data.
 */
export function openApiRoutes(): Router {
  const document = buildApiDocument();
  const router = Router();
  router.get('/openapi.json', (_request, response) => {
    response.json(document);
  });
  router.get('/reference', (_request, response) => {
    response.type('html').send(REFERENCE_HTML);
  });
  router.get('/reference/:file', (request, response) => {
    const served = Object.hasOwn(REFERENCE_FILES, request.params.file) ? REFERENCE_FILES[request.params.file] : undefined;
    if (!served) throw HttpError.notFound(`The reference page has no file ${JSON.stringify(request.params.file)}.`);
    if ('file' in served) response.sendFile(served.file, { maxAge: '1h' });
    else response.type(served.type).send(served.text);
  });
  return router;
}
