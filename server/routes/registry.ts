import type { Request, Response } from 'express';
import type { z } from 'zod';
import type { SiteRole, TeamRole } from '@shared/schemas/roles';
import type { AppDeps, Principal, RequestMeta } from '../context';
import { AppError } from '../errors';

/**
 * Who may call a route: anyone; anyone signed in; members of the :teamId team with at least the
 * given role; or holders of a site role. A site admin has no automatic team access, and the
 * site roles do not include each other (a site admin is not a curator unless given that role too).
 */
export type Access = 'public' | 'signed_in' | { team: TeamRole } | { site: SiteRole };

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

/** What a handler receives: the validated request parts and the app's services. */
export interface RouteContext<P, Q, B> {
  params: P;
  query: Q;
  body: B;
  /** Null only on public routes called anonymously. */
  principal: Principal | null;
  /** The caller's role in :teamId, on team routes. */
  teamRole: TeamRole | null;
  deps: AppDeps;
  meta: RequestMeta;
  req: Request;
  res: Response;
}

/** A route declared as data; the router and the OpenAPI document are both built from these. */
export interface RouteDefinition<
  P extends z.ZodType | undefined = z.ZodType | undefined,
  Q extends z.ZodType | undefined = z.ZodType | undefined,
  B extends z.ZodType | undefined = z.ZodType | undefined,
> {
  method: HttpMethod;
  /** Express-style path below /api/v1, e.g. "/teams/:teamId/notes". */
  path: string;
  summary: string;
  description?: string;
  tags: string[];
  access: Access;
  request?: { params?: P; query?: Q; body?: B };
  /** Reply schema per status; null means no body (204, 202). The lowest 2xx is the success status. */
  responses: Record<number, z.ZodType | null>;
  /** Calculation endpoints share a per-address request limit. */
  rateLimit?: 'calc';
  /** Returns the reply body (ignored for a body-less success status). */
  handler: (ctx: RouteContext<Parsed<P>, Parsed<Q>, Parsed<B>>) => unknown;
}

/** A route of any shape, as kept in the registry. */
// The handler's context is checked inside defineRoute; the list only needs the common shape.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnyRoute = RouteDefinition<any, any, any>;

/** Declares a route, inferring the handler's parameter types from its zod schemas. */
export function defineRoute<
  P extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
>(route: RouteDefinition<P, Q, B>): AnyRoute {
  return route as AnyRoute;
}

/** Base path of the versioned API. */
export const API_PREFIX = '/api/v1';

/** "GET /api/v1/teams/:teamId/notes": the key tests and logs use for a route. */
export function routeKey(route: Pick<AnyRoute, 'method' | 'path'>): string {
  return `${route.method.toUpperCase()} ${API_PREFIX}${route.path}`;
}

/** The status a handler's return value is sent with. */
export function successStatus(route: AnyRoute): number {
  const ok = Object.keys(route.responses)
    .map(Number)
    .filter((s) => s >= 200 && s < 300)
    .sort((a, b) => a - b);
  return ok[0] ?? 200;
}

/** Plain words for an access level, for error messages and the OpenAPI document. */
export function describeAccess(access: Access): string {
  if (access === 'public') return 'anyone';
  if (access === 'signed_in') return 'any signed-in user';
  if ('team' in access) return `team members with role ${access.team} or above`;
  return `users with the site role ${access.site}`;
}

/** The principal of a signed-in route (the access check guarantees one). */
export function signedIn(ctx: Pick<RouteContext<unknown, unknown, unknown>, 'principal'>): Principal {
  if (!ctx.principal) throw new AppError('unauthenticated', 'Sign in first, or send an API token.');
  return ctx.principal;
}
