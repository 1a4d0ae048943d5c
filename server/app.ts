import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import compression from 'compression';
import express, { type Router } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import pg from 'pg';
import type { AppDeps, AppInput } from './platform/deps';
import { Background } from './platform/background';
import { configurePassport } from './auth/passport';
import { createSessionStore } from './auth/session-store';
import { authRoutes, isCsrfExempt } from './auth/auth.routes';
import { csrfProtection } from './platform/http/middleware';
import { refuseHostileInput } from './platform/http/ingress';
import { errorHandler } from './platform/http/error-handler';
import { notFound } from './platform/errors';
import { teamRoutes } from './auth/team.routes';
import { businessRoutes } from './business/business.routes';
import { systemRoutes } from './system/system.routes';
import { costingRouters } from './costing/costing.routes';
import { suppliersRoutes } from './suppliers/suppliers.routes';
import { booksRouters } from './books/books.routes';
import { ordersRoutes } from './orders/orders.routes';
import { paymentsRoutes, paymentsWebhookRoutes } from './payments/payments.routes';
import { stockRoutes } from './stock/stock.routes';
import { repricingRoutes } from './repricing/repricing.routes';


const distDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../dist');

/** The Express app; it never listens (server/index.ts does, tests use supertest). */
export function createApp(input: AppInput) {
  const deps: AppDeps = { ...input, background: new Background(input.logger) };
  const { db, config, logger } = deps;
  const app = express();
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');

  app.use((req, res, next) => {
    res.setHeader('x-request-id', randomUUID());
    next();
  });
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'frame-ancestors': ["'none'"],
          // Plain http on loopback must not be upgraded (helmet's default would).
          'upgrade-insecure-requests': config.cookieSecure ? [] : null,
        },
      },
      strictTransportSecurity: config.cookieSecure,
    }),
  );

  // Every answer compressed (brotli where the browser takes it, else gzip): the client's
  // JavaScript, the API's JSON and the CSV exports alike.
  app.use(compression({ threshold: 1024 }));

  // Routes that need the raw body (webhook signatures) are mounted here, before the JSON parser.
  for (const r of rawBodyRouters(deps)) app.use(r);

  app.use(express.json({ limit: '1mb' }));
  app.use(refuseHostileInput);

  const sessionPool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 5 });
  const sessionStore = createSessionStore(sessionPool);
  /** Waits for work done after answers (e-mails), e.g. before a test checks the mailbox is empty. */
  app.locals.idle = () => deps.background.idle();
  app.locals.shutdown = async () => {
    await deps.background.idle();
    sessionStore.close();
    await sessionPool.end();
  };
  app.use(
    session({
      name: 'tt.sid',
      store: sessionStore,
      secret: config.SESSION_SECRET,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: 1000 * 60 * 60 * 12 },
    }),
  );
  const passport = configurePassport(db);
  app.use(passport.initialize());
  app.use(passport.session());
  app.use(csrfProtection(isCsrfExempt));


  for (const r of apiRouters(deps, passport)) app.use(r);

  app.use('/api', () => {
    throw notFound('That API route');
  });

  if (fs.existsSync(path.join(distDir, 'index.html'))) {
    // Built assets carry a hash of their content in their names: cache them for a year, never
    // revalidate. index.html names the current ones, so it is always asked for again.
    app.use(
      '/assets',
      express.static(path.join(distDir, 'assets'), { index: false, immutable: true, maxAge: '365d' }),
      // An asset of an older build is gone: say so, rather than answer with the page.
      (_req: express.Request, res: express.Response) => void res.status(404).end(),
    );
    app.use(express.static(distDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('cache-control', 'no-cache');
      res.sendFile(path.join(distDir, 'index.html'));
    });
  }

  app.use(errorHandler(logger));
  return app;
}

/** Every domain's router, each defining full /api paths (the route table test walks them). */
function apiRouters(deps: AppDeps, passport: ReturnType<typeof configurePassport>): Router[] {
  return [systemRoutes(deps), authRoutes(deps, passport), teamRoutes(deps), businessRoutes(deps), ...costingRouters(deps), suppliersRoutes(deps), ...booksRouters(deps), repricingRoutes(deps), ordersRoutes(deps), paymentsRoutes(deps), stockRoutes(deps)];
}

function rawBodyRouters(deps: AppDeps): Router[] {
  return [paymentsWebhookRoutes(deps)];
}

