import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import type { AppConfig } from './env';
import type { AppDeps } from './context';
import type { Db } from './db/client';
import type { Mailer } from './mail/mailer';
import { authenticate } from './middleware/auth';
import { csrfGuard } from './middleware/csrf';
import { errorHandler } from './middleware/error-handler';
import { apiNotFound } from './middleware/not-found';
import { RateLimits } from './middleware/rate-limit';
import { LibraryCache } from './library/snapshot';
import { requestId } from './middleware/request-id';
import { securityHeaders } from './middleware/security-headers';
import { buildRouter } from './routes/build-router';
import { apiRoutes } from './routes/index';
import { API_PREFIX, type AnyRoute } from './routes/registry';

export interface CreateAppOptions {
  db: Db;
  mailer: Mailer;
  config: AppConfig;
  /** Built client to serve (default ./dist when it exists); null serves no client. */
  clientDir?: string | null;
  /** Extra routes (tests register a curator-only route this way). */
  extraRoutes?: readonly AnyRoute[];
}

/** The app plus the route list and counters it was built with. */
export interface ThermoledgerApp extends Express {
  locals: Express['locals'] & { deps: AppDeps; routes: AnyRoute[] };
}

/** Builds the Express app without listening, so tests can drive it over HTTP on any port. */
export function createApp(options: CreateAppOptions): ThermoledgerApp {
  const deps: AppDeps = {
    db: options.db,
    mailer: options.mailer,
    config: options.config,
    limits: new RateLimits(options.config),
    library: new LibraryCache(options.db),
  };
  const routes = apiRoutes(options.extraRoutes);
  const app = express() as ThermoledgerApp;
  app.locals.deps = deps;
  app.locals.routes = routes;
  app.disable('x-powered-by');
  app.set('trust proxy', options.config.trustProxy);
  app.set('env', options.config.nodeEnv === 'production' ? 'production' : 'development');

  app.use(requestId());
  app.use(securityHeaders());
  app.use(API_PREFIX, (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  app.use(API_PREFIX, express.json({ limit: '1mb', type: ['application/json', 'application/*+json'] }));
  app.use(API_PREFIX, cookieParser());
  app.use(API_PREFIX, authenticate(deps));
  app.use(API_PREFIX, csrfGuard(options.config.publicUrl));
  app.use(API_PREFIX, buildRouter(routes, deps));
  app.use('/api', apiNotFound());

  const clientDir = options.clientDir === undefined ? path.resolve('dist') : options.clientDir;
  if (clientDir && existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // History-mode client routes: any other GET gets the app shell.
    app.get(/^(?!\/api(\/|$)).*/, (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }
  app.use(errorHandler());
  return app;
}
