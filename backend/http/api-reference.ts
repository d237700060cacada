import express, { type Router } from 'express';
import swaggerUi from 'swagger-ui-express';
import type { ApiDocument } from '../api-document';

/**
 * Our header over the stock reference page: the product's name and a way back to it. It is a
 * script file of our own (not inline) because the Content-Security-Policy allows only scripts
 * from this origin.
 */
const HEADER_SCRIPT = `(() => {
  const bar = document.createElement('header');
  bar.setAttribute('role', 'banner');
  bar.className = 'cdy-bar';
  const home = document.createElement('a');
  home.href = '/';
  home.textContent = '← Conductory';
  const title = document.createElement('span');
  title.textContent = 'API reference (openapi.yaml)';
  const raw = document.createElement('a');
  raw.href = '/api/openapi.json';
  raw.textContent = 'Document as JSON';
  bar.append(home, title, raw);
  document.body.prepend(bar);
  // Swagger UI draws its controls later; name the ones it leaves unnamed as they appear.
  const name = () => {
    for (const select of document.querySelectorAll('select:not([aria-label])')) {
      const label = select.closest('.servers') ? 'Server' : select.id || 'Choice';
      select.setAttribute('aria-label', label);
    }
  };
  new MutationObserver(name).observe(document.body, { childList: true, subtree: true });
  name();
})();
`;

/** Colours of our own header (the product's patina and paper), with contrast above 7:1. */
const HEADER_CSS = `
.swagger-ui .topbar { display: none; }
.cdy-bar { display: flex; flex-wrap: wrap; gap: 1rem; align-items: center; padding: 0.75rem 1.25rem;
  background: #12372f; color: #f7f5f0; font: 500 15px/1.4 system-ui, sans-serif; }
.cdy-bar a { color: #f7f5f0; text-decoration: underline; }
.cdy-bar span { flex: 1; }
.swagger-ui .opblock.opblock-get .opblock-summary-method { background: #1e4f7a !important; }
.swagger-ui .opblock.opblock-post .opblock-summary-method { background: #1d5c3a !important; }
.swagger-ui .opblock.opblock-put .opblock-summary-method { background: #7a4d00 !important; }
.swagger-ui .opblock.opblock-patch .opblock-summary-method { background: #4f3a7a !important; }
.swagger-ui .opblock.opblock-delete .opblock-summary-method { background: #8a1c1c !important; }
.swagger-ui .opblock .opblock-summary-description,
.swagger-ui .info p, .swagger-ui .info li { color: #1d2421; }
.swagger-ui .btn.authorize { color: #1d5c3a; border-color: #1d5c3a; }
.swagger-ui .btn.authorize svg { fill: #1d5c3a; }
.swagger-ui .info .title small { background: #4a5560; }
.swagger-ui .info .title small.version-stamp { background: #1d5c3a; }
`;

/** Swagger UI over openapi.yaml, with our header: mounted at /api/docs, before the validator. */
export function apiReference(doc: ApiDocument): Router {
  const router = express.Router();
  router.get('/header.js', (_req, res) => {
    res.type('text/javascript').send(HEADER_SCRIPT);
  });
  router.use(
    swaggerUi.serve,
    swaggerUi.setup(doc, {
      customSiteTitle: 'Conductory API reference',
      customCss: HEADER_CSS,
      customJs: '/api/docs/header.js',
    }),
  );
  return router;
}
