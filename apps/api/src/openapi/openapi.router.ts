import { Router, type RequestHandler } from 'express';
import swaggerUi from 'swagger-ui-express';
import { openApiDocument } from './document';

/**
 * `GET /api/openapi.json` (no sign-in) and the reference page at `/api/docs/`. The page's
 * script is a file of its own (swagger-ui-init.js), so it runs under the app's CSP, which
 * allows no inline script.
 */
export function openApiRouter(): Router {
  const router = Router();
  router.get('/openapi.json', (_req, res) => {
    res.json(openApiDocument());
  });
  // the page's relative asset URLs need the trailing slash
  const withSlash: RequestHandler = (req, res, next) => {
    if (req.originalUrl.split('?')[0]!.endsWith('/docs')) res.redirect(301, `${req.baseUrl}/`);
    else next();
  };
  router.use(
    '/docs',
    withSlash,
    swaggerUi.serveFiles(undefined, { swaggerOptions: { url: '/api/openapi.json' } }),
    swaggerUi.setup(undefined, {
      customSiteTitle: 'Rhotrace API',
      // the page is Rhotrace's reference, without the tool's own top bar
      customCss: '.swagger-ui .topbar { display: none }',
      swaggerOptions: { url: '/api/openapi.json' },
    }),
  );
  return router;
}
