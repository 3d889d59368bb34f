import express, { type Express } from 'express';
import helmet from 'helmet';
import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import path from 'node:path';
import fs from 'node:fs';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type { Db } from '../db/client';
import type { Ctx } from './context';
import { AppError, errorMiddleware } from './errors';
import { createLogger, redactUrl } from './logger';
import { jsonGuard } from './middleware/json-guard';
import { sameOrigin } from './middleware/same-origin';
import { requireUser, sessionMiddleware, sessionOptions } from './middleware/session';
import { routeFactories } from './routes';
import { devMailRouter } from './mail/dev-mail';
import { noopMailer, type Mailer } from './mail/mailer';
import type { RouteDef } from './routes/route';
import { createLocalStorage, type ObjectStorage } from './storage';

export interface AppOptions {
  db: Db;
  sessionPassword: string;
  secureCookies?: boolean;
  /** The exported web build to serve beside /api; omitted in API-only tests. */
  webDir?: string;
  now?: () => Date;
  logger?: Logger;
  trustProxy?: string | boolean;
  /** Development only: the Metro dev server's origin, allowed to call /api with credentials. */
  devOrigin?: string;
  /** Sign-in/sign-up attempts per address and e-mail in a 15-minute window. */
  signInLimit?: number;
  /** Where photos are kept; default: the local-folder driver under ./uploads (server/index.ts passes UPLOADS_DIR). */
  storage?: ObjectStorage;
  /** Where e-mail goes; default: sends nothing. */
  mailer?: Mailer;
  /** The address in e-mailed links; default http://127.0.0.1:8080. */
  publicUrl?: string;
  /** The local fake mailbox folder: when set, GET /dev/mail lists its messages (never in production). */
  devMailDir?: string;
}

export interface CreatedApp {
  app: Express;
  ctx: Ctx;
  /** Every API route, for tests that must cover them all. */
  routes: RouteDef[];
}

/** Builds the Express app without listening, so tests can boot it on any port. */
export function createApp(opts: AppOptions): CreatedApp {
  const logger = opts.logger ?? createLogger('silent');
  const ctx: Ctx = {
    db: opts.db,
    now: opts.now ?? (() => new Date()),
    logger,
    storage: opts.storage ?? createLocalStorage('uploads'),
    mailer: opts.mailer ?? noopMailer,
    publicUrl: (opts.publicUrl ?? 'http://127.0.0.1:8080').replace(/\/+$/, ''),
  };
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', opts.trustProxy ?? 'loopback');

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'script-src': ["'self'"],
          // react-native-web writes its styles at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
      // The app is served over plain HTTP on loopback; HSTS only makes sense behind HTTPS.
      strictTransportSecurity: opts.secureCookies ? undefined : false,
    }),
  );
  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      // Invitation and reset links carry their token in the path: keep it out of the log.
      serializers: { req: (r: { url?: string }) => ({ ...r, url: redactUrl(r.url) }) },
    }),
  );
  if (opts.devOrigin) app.use('/api', devCors(opts.devOrigin));
  // CSRF: writes must come from the app's own origin (SameSite=Lax on the cookie is the other layer).
  app.use('/api', sameOrigin({ publicUrl: ctx.publicUrl, devOrigin: opts.devOrigin }));
  // Bodies stay small, except an account export (POST /api/import), which its route reads
  // itself after the sign-in check, so a stranger cannot make the server parse megabytes.
  const smallJson = express.json({ limit: '256kb' });
  app.use('/api', (req, res, next) => (req.path === '/import' ? next() : smallJson(req, res, next)));
  // NUL characters and absurd nesting are refused before any route (PostgreSQL cannot keep a NUL).
  app.use('/api', jsonGuard);

  const sOpts = sessionOptions(opts.sessionPassword, opts.secureCookies ?? false);
  app.use('/api', sessionMiddleware(ctx, sOpts));

  const signInLimiter = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: opts.signInLimit ?? 10,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Per address and e-mail: one person's typos do not lock out a shared club network.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').toLowerCase().slice(0, 254)}`,
    handler: (_req, _res, next) =>
      next(new AppError('rate_limited', 'Too many sign-in attempts. Wait a few minutes and try again.', 429)),
  });

  const routes = routeFactories.flatMap((f) => f(ctx, { signInLimiter, sessionOptions: sOpts }));
  for (const r of routes) {
    const chain = [...(r.auth ? [requireUser] : []), ...(r.before ?? [])];
    app[r.method](r.path, ...chain, async (req, res) => {
      await r.handler(req, res);
    });
  }
  app.use('/api', (_req, _res, next) => next(new AppError('not_found', 'There is no such API address.', 404)));

  if (opts.devMailDir) app.use(devMailRouter(opts.devMailDir));
  if (opts.webDir) serveWeb(app, opts.webDir);
  app.use(errorMiddleware(logger));
  return { app, ctx, routes };
}

/** In `npm run dev` the app comes from Metro on another port; only that origin is let in. */
function devCors(origin: string): express.RequestHandler {
  return (req, res, next) => {
    if (req.headers.origin !== origin) return next();
    res.setHeader('Access-Control-Allow-Origin', origin);
    res.setHeader('Access-Control-Allow-Credentials', 'true');
    res.setHeader('Access-Control-Allow-Headers', 'Content-Type, Idempotency-Key');
    res.setHeader('Access-Control-Allow-Methods', 'GET, POST, PATCH, PUT, DELETE');
    res.setHeader('Vary', 'Origin');
    if (req.method === 'OPTIONS') return void res.status(204).end();
    next();
  };
}

/** Serves the exported web build; deep links answer with the app's index.html. */
function serveWeb(app: Express, webDir: string) {
  const dir = path.resolve(webDir);
  const index = path.join(dir, 'index.html');
  app.use(
    '/_expo',
    express.static(path.join(dir, '_expo'), { immutable: true, maxAge: '365d', fallthrough: false }),
  );
  app.use(express.static(dir, { index: false, maxAge: '1h' }));
  app.get(/^(?!\/api\/).*/, (_req, res, next) => {
    if (!fs.existsSync(index)) return next(new AppError('not_built', 'The web app has not been built yet. Run npm start.', 503));
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
