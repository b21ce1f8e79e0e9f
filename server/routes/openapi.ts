import { z } from 'zod';
import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { describeAccess } from '@shared/schemas/access';
import { errorEnvelopeSchema } from '@shared/schemas/errors';
import type { AppConfig } from '../env';
import { API_PREFIX, type AnyRoute } from './registry';

const ERROR_DESCRIPTIONS: Record<number, string> = {
  400: 'Invalid input (validation_failed, parse_error or bad_request).',
  401: 'Not signed in, or wrong credentials.',
  403: 'Signed in, but the role or origin does not allow this.',
  404: 'No such resource.',
  409: 'Conflicts with the current state.',
  410: 'The link or token has expired or was used.',
  413: 'Body too large, or the request asks for more work than a work limit allows (details: limit, max, found).',
  415: 'Body is not JSON.',
  429: 'Too many requests; see Retry-After.',
  503: 'Unavailable: the calculation exceeded its time budget, the calculation queue is full, or e-mail could not be sent; see Retry-After.',
};

function errorResponsesFor(route: AnyRoute): number[] {
  const codes = [400];
  if (route.access !== 'public') codes.push(401, 403);
  if (route.path.includes(':')) codes.push(404);
  if (route.request?.body) codes.push(413, 415);
  if (route.rateLimit) codes.push(429, 503);
  return codes;
}

/** The OpenAPI 3.1 document for the given routes, built from the same definitions as the router. */
export function buildOpenApiDocument(routes: readonly AnyRoute[], config: AppConfig): object {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'sessionCookie', { type: 'apiKey', in: 'cookie', name: 'tl_session' });
  registry.registerComponent('securitySchemes', 'apiToken', {
    type: 'http',
    scheme: 'bearer',
    description: 'Personal API token "tl_…"',
  });
  const errorSchema = errorEnvelopeSchema;

  for (const route of routes) {
    const responses: Record<string, { description: string; content?: Record<string, { schema: unknown }> }> = {};
    for (const [status, schema] of Object.entries(route.responses)) {
      responses[status] = schema
        ? { description: 'Success', content: { [route.produces ?? 'application/json']: { schema } } }
        : { description: 'Success, no body' };
    }
    for (const status of errorResponsesFor(route)) {
      responses[String(status)] ??= {
        description: ERROR_DESCRIPTIONS[status] ?? 'Error',
        content: { 'application/json': { schema: errorSchema } },
      };
    }
    registry.registerPath({
      method: route.method,
      path: API_PREFIX + route.path.replace(/:(\w+)/g, '{$1}'),
      summary: route.summary,
      description: [
        route.description,
        `Access: ${describeAccess(route.access)}.`,
        route.describeLimits
          ? `Work limits:\n${route
              .describeLimits(config)
              .map((l) => `- ${l}`)
              .join('\n')}`
          : undefined,
      ]
        .filter(Boolean)
        .join('\n\n'),
      tags: route.tags,
      security: route.access === 'public' ? [] : [{ sessionCookie: [] }, { apiToken: [] }],
      'x-access': route.access,
      request: {
        ...(route.request?.params ? { params: route.request.params } : {}),
        ...(route.request?.query ? { query: route.request.query } : {}),
        ...(route.request?.body
          ? { body: { required: true, content: { 'application/json': { schema: route.request.body } } } }
          : {}),
        ...(route.upload
          ? {
              body: {
                required: true,
                content: {
                  'multipart/form-data': {
                    schema: z.object({ [route.upload.field]: z.array(z.string().describe('a file (binary)')) }),
                  },
                },
              },
            }
          : {}),
      },
      // The generator accepts zod schemas or reference objects here.
      responses: responses as never,
    });
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: { title: 'Thermoledger API', version: config.version, description: 'Reaction enthalpies a team can defend.' },
    servers: [{ url: '/' }],
  });
}
