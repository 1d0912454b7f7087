/**
 * The reference page: Swagger UI (the `swagger-ui-dist` package, served from the app, no CDN)
 * rendering /api/openapi.json. Its script is a file of its own, not inline, so the app's
 * Content-Security-Policy (`script-src 'self'`) holds; the font is the app's own Roboto.
 */
export const REFERENCE_HTML = `<!doctype html>
<html lang="en">
  <head>
    <meta charset="utf-8">
    <title>Bellkeep API reference</title>
    <meta name="viewport" content="width=device-width, initial-scale=1">
    <link rel="stylesheet" href="/api/reference/swagger-ui.css">
    <link rel="stylesheet" href="/api/reference/page.css">
  </head>
  <body>
    <div id="reference"></div>
    <script src="/api/reference/swagger-ui-bundle.js"></script>
    <script src="/api/reference/start.js"></script>
  </body>
</html>
`;

/** Starts Swagger UI on the document; no validator badge (it would call a server elsewhere). */
export const REFERENCE_SCRIPT = `window.SwaggerUIBundle({
  url: '/api/openapi.json',
  dom_id: '#reference',
  validatorUrl: null,
  deepLinking: true,
  persistAuthorization: false,
});
`;

export const REFERENCE_CSS = `@font-face {
  font-family: 'Roboto';
  font-weight: 400;
  font-display: swap;
  src: url('/api/reference/roboto-latin-400-normal.woff2') format('woff2');
}
@font-face {
  font-family: 'Roboto';
  font-weight: 700;
  font-display: swap;
  src: url('/api/reference/roboto-latin-700-normal.woff2') format('woff2');
}
body { margin: 0; }
.swagger-ui, .swagger-ui .info .title, .swagger-ui .opblock-tag, .swagger-ui .opblock .opblock-summary-description,
.swagger-ui .btn, .swagger-ui .parameter__name, .swagger-ui table thead tr th, .swagger-ui .response-col_status,
.swagger-ui .model-title, .swagger-ui section.models h4, .swagger-ui .info li, .swagger-ui .info p, .swagger-ui .markdown p,
.swagger-ui .renderedMarkdown p, .swagger-ui .opblock-description-wrapper p, .swagger-ui .tab li, .swagger-ui label {
  font-family: 'Roboto', sans-serif;
}
`;
