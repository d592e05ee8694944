import path from 'node:path';
import fs from 'node:fs';
import express, { type Request, type Response, type NextFunction } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import pinoHttp from 'pino-http';
// eslint-disable-next-line @typescript-eslint/no-require-imports
const SequelizeStoreFactory = require('connect-session-sequelize');
import type { Deps } from './deps';
import { apiRoutes } from './routes';
import { errorBody, mountRoutes, type RouteSpec } from './lib/routes';
import { throttleTouch } from './middleware/session-touch';
import { serveWebAssets } from './lib/static-assets';
import { prerenderedFileFor } from './lib/prerender';

export const SESSION_COOKIE = 'spinyard.sid';
export const SESSION_MAX_AGE_MS = 14 * 24 * 3600 * 1000;
/** API paths (under /api) whose JSON bodies may reach 25 MB: networks, their versions, runs and previews. */
export const LARGE_JSON_PATHS = /^\/(networks(\/\d+\/versions)?|runs(\/preview)?)\/?$/;

export interface AppExtras {
  /** Middleware that sets req.auth from the session or a Bearer token (accounts). */
  authenticate?: (req: Request, res: Response, next: NextFunction) => void;
  /** Extra routes (tests). */
  routes?: RouteSpec[];
}

/** The Express application: API under /api, the exported web app from the same origin. */
export function createApp(deps: Deps, extras: AppExtras = {}) {
  const { config, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.NODE_ENV === 'production' ? 1 : false);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"], // react-native-web writes its styles into <style> tags
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  // Browser features the app never uses stay off for it and anything it might embed.
  app.use((_req, res, next) => {
    res.setHeader('Permissions-Policy', 'camera=(), microphone=(), geolocation=(), payment=(), usb=()');
    next();
  });
  if (config.NODE_ENV !== 'test') app.use(
      pinoHttp({
        logger,
        autoLogging: { ignore: (req) => !req.url?.startsWith('/api') || req.url === '/api/health' },
        serializers: { req: (r) => ({ method: r.method, url: r.url }), res: (r) => ({ status: r.statusCode }) },
      }),
    );

  const SequelizeStore = SequelizeStoreFactory(session.Store);
  const store = new SequelizeStore({ db: deps.db, table: 'Session', checkExpirationInterval: 15 * 60 * 1000, expiration: SESSION_MAX_AGE_MS });
  throttleTouch(store); // one expiry UPDATE per session per minute, not per request
  const api = express.Router();
  api.use('/billing/webhook', express.raw({ type: '*/*', limit: '1mb' }));
  // Whole networks (and runs that pin their depots) may be large; nothing else needs more than 1 MB,
  // and a small limit elsewhere keeps anonymous routes (sign-in, sign-up) from parsing 25 MB bodies.
  const largeJson = express.json({ limit: '25mb' });
  const smallJson = express.json({ limit: '1mb' });
  // Large bodies only for callers that carry a credential at all (checked properly just after).
  const credentialed = (req: Request) => !!req.headers.authorization || (req.headers.cookie ?? '').includes(`${SESSION_COOKIE}=`);
  api.use((req, res, next) => (LARGE_JSON_PATHS.test(req.path) && credentialed(req) ? largeJson : smallJson)(req, res, next));
  api.use(
    session({
      name: SESSION_COOKIE,
      secret: config.SESSION_SECRET,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.NODE_ENV === 'production', maxAge: SESSION_MAX_AGE_MS },
    }),
  );
  api.use((req, _res, next) => {
    req.auth = null;
    next();
  });
  if (extras.authenticate) api.use(extras.authenticate);
  mountRoutes(api, [...apiRoutes(deps), ...(extras.routes ?? [])]);
  api.use((_req, res) => res.status(404).json({ error: 'No such API route. See /api/openapi.json for the list.' }));
  api.use((err: unknown, req: Request, res: Response, _next: NextFunction) => {
    const { status, body } = errorBody(err);
    if (status >= 500) logger.error({ err, url: req.originalUrl }, 'request failed');
    res.status(status).json(body);
  });
  app.use('/api', api);

  const webDir = config.WEB_DIR ?? path.resolve(__dirname, '..', 'dist', 'web');
  const indexHtml = path.join(webDir, 'index.html');
  // Brotli/gzip copies written at build; hashed names cached for a year, pages revalidated (lib/static-assets).
  const webAssets = serveWebAssets(webDir);
  app.use(webAssets);
  // Single-page app fallback (Express 5 has no '*' route): every other GET gets index.html,
  // except pages prerendered at build (lib/prerender), sent like any file (compressed, no-cache).
  app.use((req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const prerendered = prerenderedFileFor(req.path);
    if (prerendered && fs.existsSync(path.join(webDir, prerendered))) {
      req.url = `/${prerendered}`;
      return webAssets(req, res, next);
    }
    if (!fs.existsSync(indexHtml)) {
      res.status(503).type('text/plain').send('The web app has not been built yet. Run `npm run build:web` (npm start does this for you).');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
  /** Stop background timers (the session store's expiry sweep). */
  const dispose = () => store.stopExpiringSessions?.();
  return { app, sessionStore: store, dispose };
}
