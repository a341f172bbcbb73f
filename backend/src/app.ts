/** createApp builds the Express application from its dependencies; server.ts listens. */
import compression from 'compression';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { createAuthenticate } from './auth/authenticate.js';
import { configurePassport } from './auth/passport-setup.js';
import type { Config } from './config.js';
import { errorHandler } from './http/error-handler.js';
import { createSessionStore } from './http/session-store.js';
import { notFound } from './http/app-error.js';
import { mountRoutes, type RouteSpec } from './http/route-registry.js';
import { trustProxySetting } from './http/trust-proxy.js';
import { createHttpLogger, type Logger } from './logger.js';
import type { Mailer } from './mail/mailer.js';
import { configureGoogle, googleConfigured } from './auth/google-strategy.js';
import { accountRoutes } from './routes/account.routes.js';
import { apiTokenRoutes } from './routes/api-token.routes.js';
import { auditRoutes } from './routes/audit.routes.js';
import { billingRoutes } from './routes/billing.routes.js';
import { calcRoutes } from './routes/calc.routes.js';
import { caseRoutes } from './routes/case.routes.js';
import { cleaningMethodRoutes } from './routes/cleaning-method.routes.js';
import { clientGroupRoutes } from './routes/client-group.routes.js';
import { devMailboxRoutes } from './routes/dev-mailbox.routes.js';
import { googleAuthRoutes } from './routes/google-auth.routes.js';
import { healthRoutes } from './routes/health.routes.js';
import { importRoutes } from './routes/import.routes.js';
import { plantRoutes } from './routes/plant.routes.js';
import { unitRoutes } from './routes/unit.routes.js';
import { unitHealthRoutes } from './routes/unit-health.routes.js';
import { portfolioRoutes } from './routes/portfolio.routes.js';
import { notificationRoutes } from './routes/notification.routes.js';
import { invitationRoutes } from './routes/invitation.routes.js';
import { memberRoutes } from './routes/member.routes.js';
import { openApiRoutes } from './routes/openapi.routes.js';
import { outageRoutes } from './routes/outage.routes.js';
import { SESSION_COOKIE, sessionRoutes } from './routes/session.routes.js';
import { describeSession } from './services/session.service.js';

export interface AppDeps {
  config: Config;
  dataSource: DataSource;
  logger: Logger;
  mailer: Mailer;
  /** The local SMTP sink is in use (loopback, no SMTP_URL): the mailbox page is mounted. */
  devMailbox?: boolean;
  /** Built front end to serve (frontend/dist); omitted in API tests and with the Vite dev server. */
  staticDir?: string;
}

export interface CleancaseApp extends Express {
  locals: Express['locals'] & { routes: RouteSpec[]; close: () => Promise<void> };
}

export function createApp(deps: AppDeps): CleancaseApp {
  const { config, dataSource, logger } = deps;
  const app = express() as CleancaseApp;
  app.disable('x-powered-by');
  app.set('trust proxy', trustProxySetting(config.TRUST_PROXY));

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: { 'img-src': ["'self'", 'data:'], 'style-src': ["'self'", "'unsafe-inline'"], 'upgrade-insecure-requests': null },
      },
    }),
  );
  app.use(createHttpLogger(logger));
  // Every API answer may carry private data: no browser or proxy keeps a copy (RFC 9111 no-store).
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // Stripe signs the exact bytes it sends: the webhook's body is kept raw (express.json then leaves it alone).
  app.use('/api/billing/webhook', express.raw({ type: '*/*', limit: '1mb' }));
  app.use(express.json({ limit: '1mb' }));

  const store = createSessionStore(dataSource);
  const secureCookie = config.COOKIE_SECURE || (config.PUBLIC_URL?.startsWith('https://') ?? false);
  app.use(
    session({
      name: SESSION_COOKIE,
      secret: config.SESSION_SECRET,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: secureCookie, maxAge: 12 * 60 * 60 * 1000 },
    }),
  );
  const auth = configurePassport(dataSource);
  const withGoogle = googleConfigured(config);
  if (withGoogle) configureGoogle(auth, dataSource, config, `${config.PUBLIC_URL?.replace(/\/$/, '') ?? ''}/api/auth/google/callback`);
  app.use(auth.initialize());
  const authenticate = createAuthenticate(dataSource);
  const devMailbox = deps.devMailbox === true;
  const answerSession = async (req: express.Request, res: express.Response) => {
    req.actor = undefined;
    await new Promise<void>((resolve, reject) => authenticate(req, res, (e?: unknown) => (e ? reject(e) : resolve())));
    res.json(await describeSession(dataSource, req.actor, devMailbox));
  };

  const routes: RouteSpec[] = [
    ...healthRoutes(dataSource),
    ...sessionRoutes(dataSource, auth, answerSession, devMailbox),
    ...accountRoutes(dataSource, deps.mailer, config, answerSession),
    ...invitationRoutes(dataSource, deps.mailer, config, answerSession),
    ...memberRoutes(dataSource),
    ...clientGroupRoutes(dataSource),
    ...apiTokenRoutes(dataSource),
    ...auditRoutes(dataSource),
    ...plantRoutes(dataSource),
    ...cleaningMethodRoutes(dataSource),
    ...unitRoutes(dataSource),
    ...unitHealthRoutes(dataSource),
    ...portfolioRoutes(dataSource),
    ...notificationRoutes(dataSource, config),
    ...caseRoutes(dataSource, config),
    ...outageRoutes(dataSource),
    ...importRoutes(dataSource, config),
    ...calcRoutes(),
    ...billingRoutes(dataSource, config),
    ...(withGoogle ? googleAuthRoutes(auth) : []),
    ...(devMailbox ? devMailboxRoutes(dataSource) : []),
    ...openApiRoutes(() => routes, SESSION_COOKIE),
  ];
  mountRoutes(app, routes, authenticate);
  app.use('/api', (_req, _res, next) => next(notFound('No such API endpoint')));

  if (deps.staticDir && existsSync(deps.staticDir)) {
    const staticDir = deps.staticDir;
    const assetsDir = path.join(staticDir, 'assets') + path.sep;
    // The front end's files leave compressed (API answers are answered above and never pass here).
    app.use(compression());
    app.use(
      express.static(staticDir, {
        index: false,
        // Files under assets/ carry a hash of their content in the name: a browser may keep them for good. The app
        // shell names the current ones, so it is checked with the server on every load; anything else for an hour.
        setHeaders: (res, file) =>
          res.setHeader(
            'Cache-Control',
            file.startsWith(assetsDir) ? 'public, max-age=31536000, immutable' : file.endsWith('index.html') ? 'no-cache' : 'public, max-age=3600',
          ),
      }),
    );
    // Client-side routes: every other GET gets the app shell.
    app.get(/^\/(?!api\/).*/, (_req, res) => res.sendFile(path.join(staticDir, 'index.html'), { headers: { 'Cache-Control': 'no-cache' } }));
  }
  app.use(errorHandler);

  app.locals.routes = routes;
  app.locals.close = async () => {
    await store.close();
  };
  return app;
}
