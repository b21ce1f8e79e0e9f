import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express, type Response } from 'express';
import type { Logger } from 'pino';
import { CalcPool } from './calc/calc-pool';
import type { AppDeps } from './context';
import type { Db } from './db/client';
import type { AppConfig } from './env';
import { BackgroundJobs } from './lib/background';
import { createLogger } from './lib/logger';
import { RateLimits } from './lib/rate-limits';
import type { Mailer } from './mail/mailer';
import { authenticate } from './middleware/auth';
import { csrfGuard } from './middleware/csrf';
import { errorHandler } from './middleware/error-handler';
import { apiNotFound } from './middleware/not-found';
import { LibraryCache } from './library/snapshot';
import { requestLog } from './middleware/request-log';
import { securityHeaders } from './middleware/security-headers';
import { shareHeaders } from './middleware/share-headers';
import { buildRouter } from './routes/build-router';
import { apiRoutes } from './routes/index';
import { API_PREFIX, type AnyRoute } from './routes/registry';

export interface CreateAppOptions {
  db: Db;
  mailer: Mailer;
  config: AppConfig;
  /** Built client to serve (default ./dist when it exists); null serves no client. */
  clientDir?: string | null;
  /** Extra routes (tests register test-only routes this way). */
  extraRoutes?: readonly AnyRoute[];
  /** Logger to use (default: JSON lines on stdout at config.logLevel). */
  logger?: Logger;
}

/** The app plus the route list and dependencies it was built with. */
export interface ThermoledgerApp extends Express {
  locals: Express['locals'] & {
    deps: AppDeps;
    routes: AnyRoute[];
    /** Finishes background jobs and stops the calculation workers (the database is the caller's). */
    close(): Promise<void>;
  };
}

/** The largest JSON body any route accepts; calculation endpoints apply their own, smaller, work limits. */
const JSON_BODY_LIMIT = '1mb';

/**
 * One caching policy per kind of file: the app shell (index.html, by any URL) is revalidated
 * every time so a deploy shows at once; Vite's hashed assets never change under their name;
 * anything else (icons) may be cached for an hour.
 */
function setStaticCacheHeaders(res: Response, filePath: string): void {
  if (path.basename(filePath) === 'index.html') res.setHeader('Cache-Control', 'no-cache');
  else if (filePath.split(path.sep).includes('assets'))
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
  else res.setHeader('Cache-Control', 'public, max-age=3600');
}

/** Builds the Express app without listening, so tests can drive it over HTTP on any port. */
export function createApp(options: CreateAppOptions): ThermoledgerApp {
  const { config } = options;
  const log = options.logger ?? createLogger(config);
  const deps: AppDeps = {
    db: options.db,
    mailer: options.mailer,
    config,
    limits: new RateLimits(config),
    calc: new CalcPool(config.calc, log),
    jobs: new BackgroundJobs(log),
    log,
    library: new LibraryCache(options.db),
  };
  const routes = apiRoutes(options.extraRoutes);
  const app = express() as ThermoledgerApp;
  app.locals.deps = deps;
  app.locals.routes = routes;
  app.locals.close = async () => {
    await deps.jobs.drain();
    await deps.calc.close();
  };
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.set('env', config.nodeEnv === 'production' ? 'production' : 'development');

  app.use(requestLog(log));
  app.use(securityHeaders());
  app.use([`${API_PREFIX}/shared`, '/shared'], shareHeaders());
  app.use(API_PREFIX, (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  app.use(API_PREFIX, express.json({ limit: JSON_BODY_LIMIT, type: ['application/json', 'application/*+json'] }));
  app.use(API_PREFIX, cookieParser());
  app.use(API_PREFIX, authenticate(deps));
  app.use(API_PREFIX, csrfGuard(config.publicUrl));
  app.use(API_PREFIX, buildRouter(routes, deps));
  app.use('/api', apiNotFound());

  const clientDir = options.clientDir === undefined ? path.resolve('dist') : options.clientDir;
  if (clientDir && existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, cacheControl: false, setHeaders: setStaticCacheHeaders }));
    // History-mode client routes: any other GET gets the app shell, with the app shell's policy.
    const shell = path.join(clientDir, 'index.html');
    app.get(/^(?!\/api(\/|$)).*/, (_req, res) => {
      setStaticCacheHeaders(res, shell);
      res.sendFile(shell, { cacheControl: false });
    });
  }
  app.use(errorHandler(log));
  return app;
}
