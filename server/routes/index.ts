import { z } from 'zod';
import { accountRoutes } from './account.routes';
import { adminRoutes } from './admin.routes';
import { amendmentRoutes } from './amendments.routes';
import { balanceRoutes } from './balance.routes';
import { calorimetryRoutes, calorimetryRunRoutes } from './calorimetry.routes';
import { deriveRoutes } from './derive.routes';
import { derivedValueRoutes } from './derived-values.routes';
import { healthRoutes } from './health.routes';
import { invitationRoutes } from './invitations.routes';
import { libraryRoutes } from './library.routes';
import { libraryIoRoutes } from './library-io.routes';
import { noteRoutes } from './notes.routes';
import { notificationRoutes } from './notifications.routes';
import { buildOpenApiDocument } from './openapi';
import { passwordResetRoutes } from './password-resets.routes';
import { reactionEnthalpyRoutes } from './reaction-enthalpy.routes';
import { reactionSetRoutes } from './reaction-sets.routes';
import { defineRoute, type AnyRoute } from './registry';
import { sessionRoutes } from './session.routes';
import { teamRoutes } from './teams.routes';

const resourceRoutes: AnyRoute[] = [
  ...healthRoutes,
  ...sessionRoutes,
  ...passwordResetRoutes,
  ...invitationRoutes,
  ...accountRoutes,
  ...teamRoutes,
  ...noteRoutes,
  ...adminRoutes,
  ...balanceRoutes,
  ...libraryRoutes,
  ...libraryIoRoutes,
  ...amendmentRoutes,
  ...notificationRoutes,
  ...reactionEnthalpyRoutes,
  ...deriveRoutes,
  ...derivedValueRoutes,
  ...reactionSetRoutes,
  ...calorimetryRoutes,
  ...calorimetryRunRoutes,
];

/** The OpenAPI route describes every route in `routes` plus itself. */
function openApiRoute(routes: () => readonly AnyRoute[]): AnyRoute {
  let cached: object | undefined;
  return defineRoute({
    method: 'get',
    path: '/openapi.json',
    summary: 'This API, as an OpenAPI 3.1 document',
    tags: ['system'],
    access: 'public',
    responses: { 200: z.record(z.string(), z.unknown()) },
    handler: ({ ctx }) => (cached ??= buildOpenApiDocument(routes(), ctx.config)),
  });
}

/** Every API route, in registry form. Tests may pass extra routes to createApp. */
export function apiRoutes(extra: readonly AnyRoute[] = []): AnyRoute[] {
  const list: AnyRoute[] = [];
  list.push(
    ...resourceRoutes,
    ...extra,
    openApiRoute(() => list),
  );
  return list;
}
