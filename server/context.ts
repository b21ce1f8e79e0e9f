import type { Logger } from 'pino';
import type { SessionUser } from '@shared/schemas/session';
import type { TeamRole } from '@shared/schemas/roles';
import type { CalcPool } from './calc/calc-pool';
import type { AppConfig } from './env';
import { AppError } from './errors';
import type { Db } from './db/client';
import type { BackgroundJobs } from './lib/background';
import type { RateLimits } from './lib/rate-limits';
import type { Mailer } from './mail/mailer';
import type { LibraryCache } from './library/snapshot';

/** Who made a request, once authenticated. Tokens carry their owner's roles. */
export interface Principal {
  user: SessionUser;
  via: 'session' | 'token';
  sessionId?: string;
  tokenId?: string;
}

/** Request metadata kept in the audit log and the request log. */
export interface RequestMeta {
  ip: string | null;
  userAgent: string | null;
  requestId: string;
}

/** What every use case may reach: built once per app by createApp. */
export interface AppDeps {
  db: Db;
  mailer: Mailer;
  config: AppConfig;
  limits: RateLimits;
  calc: CalcPool;
  /** Work that runs after the reply has left (e-mail that must not delay or reveal anything). */
  jobs: BackgroundJobs;
  log: Logger;
  /** The library's snapshots per revision (in memory, shared by all requests). */
  library: LibraryCache;
}

/**
 * The first argument of every service: the app's dependencies plus who is asking and from where.
 * Built per request by the router (and by CLIs and tests with a null actor).
 */
export interface ServiceContext extends AppDeps {
  /** Null for anonymous callers (public routes) and for command-line tools. */
  actor: Principal | null;
  meta: RequestMeta;
}

/** A service context whose caller is known: what services of signed-in routes take. */
export interface ActorContext extends ServiceContext {
  actor: Principal;
}

/**
 * The one shape of a use case: a context and one input object in, a promise of a shared type out.
 * Services own their transactions; they never see Express.
 */
export type Service<Input, Result, Ctx extends ServiceContext = ServiceContext> = (
  ctx: Ctx,
  input: Input,
) => Promise<Result>;

/** Parsed request parts, kept in res.locals because Express 5's req.query is a read-only getter. */
export interface ValidatedParts {
  params: unknown;
  query: unknown;
  body: unknown;
}

// The one declaration of what the middleware chain leaves in res.locals, in the order it is set.
declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      /** request-log: the id echoed in X-Request-Id and quoted in 500 replies and logs. */
      requestId: string;
      /** authenticate: the caller, or null. */
      principal: Principal | null;
      /** authenticate: true when the request presented the session cookie (valid or not). */
      cookieAuth: boolean;
      /** requireAccess: the caller's role in :teamId, on team routes. */
      teamRole: TeamRole | null;
      /** measureWork: equation lines this calculation request asks for (weighs the line budget). */
      calcLines: number;
      /** validate: the parsed params, query and body. */
      input: ValidatedParts;
    }
  }
}

/** The context of a signed-in caller (routes whose access is not 'public' always have one). */
export function requireActor(ctx: ServiceContext): ActorContext {
  if (!ctx.actor) throw new AppError('unauthenticated', 'Sign in first, or send an API token.');
  return ctx as ActorContext;
}
