import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { Router } from 'express';
import * as z from 'zod';
import { openApiDocument } from '@shared/api/health';
import { ENDPOINTS } from '@shared/api/index';
import { routeKey, type Endpoint } from '@shared/api/endpoint';
import { PERMISSIONS } from '@shared/api/permissions';
import { ENGINE_VERSION } from '@shared/engine/index';
import { APP_VERSION } from '../health/health.router.ts';
import { mount } from '../http/endpoint.ts';

const errorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional().describe('Field path → what is wrong and what is allowed'),
  }),
});

const errorContent = { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } };
const jsonSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;

/** A CSV file upload: multipart field `file`, plus `decisions` on commit. */
function uploadSchema(kind: 'preview' | 'commit') {
  const file = z.string().meta({ format: 'binary', description: 'One UTF-8 CSV file, at most 2 MB' });
  const decisions = z.string().meta({ description: 'JSON object { "<existing name>": "new-version" | "skip" }' });
  return kind === 'commit' ? z.object({ file, decisions: decisions.optional() }) : z.object({ file });
}

const uploadContent = (kind: 'preview' | 'commit') => ({ 'multipart/form-data': { schema: uploadSchema(kind) } });

const errorResponses = (endpoint: Endpoint) => ({
  '400': { description: 'Invalid input: names each field (or CSV row and column) and what is allowed', content: errorContent },
  ...(endpoint.access === 'anyone' ? {} : { '401': { description: 'Not signed in', content: errorContent } }),
  '403': { description: 'Missing CSRF token on a write, or a role that may not do this', content: errorContent },
});

/** "anyone", "signed in", or the roles of the endpoint's permission. */
export function whoMay(endpoint: Endpoint): string {
  const access = PERMISSIONS[endpoint.access];
  return access === 'anyone' ? 'anyone' : access === 'signedIn' ? 'signed in' : access.join(', ');
}

/** The operation of a declared endpoint, generated from its zod schemas. */
function declaredRoute(endpoint: Endpoint): RouteConfig {
  if (/:\w+/.test(endpoint.path) && !endpoint.params)
    throw new Error(`${routeKey(endpoint)} has path parameters but no params schema (idParamsSchema?)`);
  const status = String(endpoint.status ?? 200);
  const success =
    endpoint.produces !== undefined
      ? { description: 'the file', content: { [endpoint.produces]: {} } }
      : status === '204'
        ? { description: 'No content' }
        : { description: 'Success', content: { 'application/json': { schema: endpoint.answer } } };
  const body = endpoint.body
    ? { body: { required: true, content: { 'application/json': { schema: endpoint.body } } } }
    : endpoint.upload
      ? { body: { required: true, content: uploadContent(endpoint.upload) } }
      : {};
  return {
    method: endpoint.method.toLowerCase() as RouteConfig['method'],
    path: endpoint.path.replace(/:(\w+)/g, '{$1}'),
    summary: endpoint.summary,
    description: [`Who: ${whoMay(endpoint)}.`, endpoint.description].filter(Boolean).join(' '),
    ...(endpoint.access === 'anyone' ? { security: [] } : {}),
    request: {
      ...(endpoint.params ? { params: endpoint.params as z.ZodObject } : {}),
      ...(endpoint.query ? { query: endpoint.query as z.ZodObject } : {}),
      ...body,
    },
    responses: { [status]: success, ...errorResponses(endpoint) },
  };
}

/** OpenAPI 3.1 description of every API route, generated from the declarations in shared/api by zod-to-openapi. */
export function buildOpenApiDocument() {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'gapwright.sid' });
  registry.registerComponent('schemas', 'Error', jsonSchema(errorSchema) as never);
  for (const endpoint of ENDPOINTS) registry.registerPath(declaredRoute(endpoint));
  const document = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Gapwright API',
      version: APP_VERSION,
      description:
        `Buck-inductor design from converter spec to the winding shop (engine ${ENGINE_VERSION}). JSON in SI units: V, A, Hz, H, T, m, W, W/m³; temperatures in °C. ` +
        'Results are engineering estimates that need qualified review. Writes need the session cookie and the X-XSRF-TOKEN header ' +
        '(the value of the XSRF-TOKEN cookie set by GET /api/auth/session).',
    },
    servers: [{ url: '/api' }],
    security: [{ session: [] }],
  });
  // A plain object: the generator's interface has no index signature, the declared answer is a JSON record.
  return { ...document };
}

/** GET /api/openapi.json; mounted at /api. */
export function openApiRouter(document: ReturnType<typeof buildOpenApiDocument>): Router {
  const router = Router();
  mount(router, openApiDocument, () => document);
  return router;
}
