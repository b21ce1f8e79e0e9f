import { Router, type Request, type RequestHandler } from 'express';
import { and, eq } from 'drizzle-orm';
import { idSchema } from '@shared/schemas/common';
import { roleLabels, teamRoleAtLeast, type TeamRole } from '@shared/schemas/roles';
import type { AppDeps } from '../context';
import { memberships } from '../db/tables/index';
import { AppError } from '../errors';
import { requestMeta } from '../middleware/auth';
import { validate } from '../middleware/validate';
import { successStatus, type Access, type AnyRoute } from './registry';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      teamRole: TeamRole | null;
    }
  }
}

async function teamRoleOf(deps: AppDeps, teamId: string, userId: string): Promise<TeamRole | null> {
  // A malformed id cannot name a team the caller belongs to; skip the query (Postgres would reject it).
  if (!idSchema.safeParse(teamId).success) return null;
  const [row] = await deps.db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    .limit(1);
  return row?.role ?? null;
}

/** Enforces a route's access level: 401 when nobody is signed in, 403 when the role is missing. */
function authorize(access: Access, deps: AppDeps): RequestHandler {
  return async (req, res, next) => {
    res.locals.teamRole = null;
    if (access === 'public') return next();
    const principal = res.locals.principal;
    if (!principal) throw new AppError('unauthenticated', 'Sign in first, or send an API token.');
    if (access === 'signed_in') return next();
    if ('site' in access) {
      if (!principal.user.siteRoles.includes(access.site)) {
        throw new AppError('forbidden', `Only a ${roleLabels[access.site].toLowerCase()} may do this.`);
      }
      return next();
    }
    const teamId = req.params['teamId'];
    if (typeof teamId !== 'string') throw new Error('Team route without :teamId');
    const role = await teamRoleOf(deps, teamId, principal.user.id);
    if (!role) throw new AppError('forbidden', 'You are not a member of this team.');
    if (!teamRoleAtLeast(role, access.team)) {
      throw new AppError(
        'forbidden',
        `This needs the team role ${roleLabels[access.team]} or above; you are ${roleLabels[role]}.`,
        { required: access.team, held: role },
      );
    }
    res.locals.teamRole = role;
    next();
  };
}

function hasBody(req: Request): boolean {
  const length = req.get('content-length');
  return (length !== undefined && length !== '0') || req.get('transfer-encoding') !== undefined;
}

/** A JSON route refuses bodies of other types with 415 (express.json() skipped them). */
function requireJsonBody(): RequestHandler {
  return (req, _res, next) => {
    if (hasBody(req) && !req.is(['application/json', 'application/*+json'])) {
      throw new AppError(
        'unsupported_media_type',
        `Send the body as JSON with "Content-Type: application/json" (got ${req.get('content-type') ?? 'no content type'}).`,
      );
    }
    next();
  };
}

function runHandler(route: AnyRoute, deps: AppDeps): RequestHandler {
  const status = successStatus(route);
  const replySchema = route.responses[status] ?? null;
  return async (req, res) => {
    const input = res.locals.input ?? { params: undefined, query: undefined, body: undefined };
    const result = await route.handler({
      params: input.params,
      query: input.query,
      body: input.body,
      principal: res.locals.principal,
      teamRole: res.locals.teamRole,
      deps,
      meta: requestMeta(req),
      req,
      res,
    });
    if (res.headersSent) return;
    if (replySchema === null) {
      res.status(status).end();
      return;
    }
    // Replies go through their schema: drift from the contract fails loudly, and no stray column leaks.
    const checked = replySchema.safeParse(result);
    if (!checked.success) {
      throw new Error(
        `Reply of ${route.method.toUpperCase()} ${route.path} breaks its schema: ${checked.error.message}`,
      );
    }
    res.status(status).json(checked.data);
  };
}

/**
 * Builds the Express router for a list of routes. Each route runs, in order: its rate limit,
 * the access check (so anonymous callers get 401 before any 400), body type check, validation, handler.
 * Authentication itself ran earlier, for every request.
 */
export function buildRouter(routes: readonly AnyRoute[], deps: AppDeps): Router {
  const router = Router();
  for (const route of routes) {
    const chain: RequestHandler[] = [];
    if (route.rateLimit === 'calc') chain.push(deps.limits.calcLimiter());
    chain.push(authorize(route.access, deps));
    if (route.request?.body) chain.push(requireJsonBody());
    chain.push(validate(route.request ?? {}));
    chain.push(runHandler(route, deps));
    router[route.method](route.path, ...chain);
  }
  return router;
}
