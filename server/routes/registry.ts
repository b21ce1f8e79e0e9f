import type { Request, Response } from 'express';
import type { z } from 'zod';
import { API_PREFIX } from '@shared/api-prefix';
import type { Access } from '@shared/schemas/access';
import type { TeamRole } from '@shared/schemas/roles';
import type { ServiceContext } from '../context';
import type { AppConfig } from '../env';
import type { UploadSpec } from '../middleware/upload';

export { API_PREFIX };
export type { Access };

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

/** What a handler receives: the validated request parts and the context to pass to one service call. */
export interface RouteContext<P, Q, B> {
  params: P;
  query: Q;
  body: B;
  /** The service context: dependencies, the caller (null on public routes called anonymously), request metadata. */
  ctx: ServiceContext;
  /** The caller's role in :teamId, on team routes. */
  teamRole: TeamRole | null;
  /** For cookies only (sign-in and sign-out); everything else goes through ctx. */
  req: Request;
  res: Response;
}

/** A handler's answer with a status other than the route's success status (e.g. health's 503). */
export class ReplyWithStatus {
  constructor(
    readonly status: number,
    readonly body: unknown,
  ) {}
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
  /** Content type of a file reply (a `FileReply`), for the OpenAPI document; JSON when absent. */
  produces?: string;
  /** Calculation endpoints share per-address limits: requests a minute, and equation lines a minute. */
  rateLimit?: 'calc';
  /**
   * Cheap measurement of the work a request asks for, on the raw body before validation: throws
   * a 413 naming the limit when it is too much, and returns the number of equation lines, which
   * weighs the request against the line budget.
   */
  measureWork?: (body: unknown, config: AppConfig) => number;
  /** The work limits of this route, in words with the configured values, for its OpenAPI description. */
  describeLimits?: (config: AppConfig) => string[];
  /** A multipart upload of files (read into req.files before the handler; no JSON body). */
  upload?: UploadSpec;
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
