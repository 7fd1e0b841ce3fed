import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { constants as zlibConstants } from 'node:zlib';
import compression from 'compression';
import express, { type Express } from 'express';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppDeps } from './deps';
import { requireBodyType } from './middleware/content-type';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { noStore } from './middleware/no-store';
import { apiRoutes } from './routes';
import { configureRawStorage } from './storage/storage';
import { SWEEP_UPLOAD_PATHS } from './sweeps/sweep.router';

/** The content security policy the built web app runs under (no request leaves the origin). */
export const CONTENT_SECURITY_POLICY = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  scriptSrcAttr: ["'none'"],
  styleSrc: ["'self'", "'unsafe-inline'"],
  imgSrc: ["'self'", 'data:', 'blob:'],
  fontSrc: ["'self'"],
  connectSrc: ["'self'"],
  objectSrc: ["'none'"],
  baseUri: ["'self'"],
  frameAncestors: ["'none'"],
  formAction: ["'self'"],
  upgradeInsecureRequests: null,
};

/**
 * The web build's own files are named after a hash of their content (`chunk-5OBG24MO.js`,
 * `styles-QUAF3PSO.css`, `media/…-COQVXTP6.woff2`), also when sent as their .br/.gz copies.
 */
const HASHED_FILE = /-[A-Z0-9]{8}\.(?:js|css|woff2?)(?:\.br|\.gz)?$/;

/** Builds the Express application: API under /api, the built web app everywhere else. */
export function createApp(deps: AppDeps): Express {
  configureRawStorage(deps.config);
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', false);
  app.use(
    helmet({
      contentSecurityPolicy: { useDefaults: false, directives: CONTENT_SECURITY_POLICY },
      crossOriginEmbedderPolicy: false,
      hsts: false,
    }),
  );
  // gzip for the web bundle and large reads; never for sign-in answers that carry a token
  app.use(
    compression({
      filter: (req, res) => !req.path.startsWith('/api/auth') && compression.filter(req, res),
      // fast settings: the big static files are precompressed, this is for JSON on the fly
      level: 1,
      brotli: { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 1 } },
    }),
  );
  app.use(
    pinoHttp({
      logger: deps.logger,
      quietReqLogger: true,
      genReqId: (req, res) => {
        const id = randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      redact: ['req.headers.authorization', 'req.headers.cookie', '*.password', '*.passwordHash'],
      // Short lines, and never a query string: a reset link carries its token there.
      serializers: {
        req: (req: { id?: unknown; method?: string; url?: string }) => ({
          id: req.id,
          method: req.method,
          path: (req.url ?? '').split('?')[0],
        }),
        res: (res: { statusCode?: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  app.use('/api', requireBodyType(SWEEP_UPLOAD_PATHS));
  app.use('/api/auth', noStore);
  app.use('/api', express.json({ limit: '1mb', strict: true }));
  app.use('/api', apiRoutes(deps));
  app.use('/api', notFoundHandler);

  const dist = deps.config.webDist;
  if (existsSync(join(dist, 'index.html'))) {
    // .br/.gz copies written at build time are sent as they are; others are compressed on the fly
    app.use(
      expressStaticGzip(dist, {
        enableBrotli: true,
        orderPreference: ['br', 'gz'],
        index: false,
        serveStatic: {
          index: false,
          maxAge: '1h',
          // A file named after its content never changes: kept a year and not asked for again
          // (not even on a reload), so a study page opened days later starts from the cache.
          setHeaders: (res, path) => {
            if (HASHED_FILE.test(path))
              res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
          },
        },
      }),
    );
    // With `root`, send checks only the file's own path for dotted names: given the absolute
    // path, it refused every deep link of a checkout under a folder such as ~/.local.
    app.get('/{*path}', (_req, res) => res.sendFile('index.html', { root: dist }));
  }
  app.use(errorHandler);
  return app;
}
