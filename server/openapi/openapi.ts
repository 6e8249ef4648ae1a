import * as z from 'zod';
import { ENGINE_VERSION } from '@shared/engine/index';
import { APP_VERSION } from '../health/health.router.ts';
import { ROUTE_DOCS, type RouteDoc } from './route-docs.ts';

const errorSchema = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: { type: 'string' },
        message: { type: 'string' },
        fields: { type: 'object', additionalProperties: { type: 'string' }, description: 'Field path → what is wrong and what is allowed' },
      },
    },
  },
} as const;

const errorContent = { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } };
const jsonSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;

function uploadBody(kind: 'preview' | 'commit') {
  const properties: Record<string, unknown> = { file: { type: 'string', format: 'binary', description: 'One UTF-8 CSV file, at most 2 MB' } };
  if (kind === 'commit') properties['decisions'] = { type: 'string', description: 'JSON object { "<existing name>": "new-version" | "skip" }' };
  return { required: true, content: { 'multipart/form-data': { schema: { type: 'object', required: ['file'], properties } } } };
}

function queryParameters(schema: z.ZodType) {
  const json = jsonSchema(schema) as { properties?: Record<string, Record<string, unknown>>; required?: string[] };
  return Object.entries(json.properties ?? {}).map(([name, property]) => ({
    name,
    in: 'query',
    required: json.required?.includes(name) ?? false,
    schema: property,
  }));
}

function operation(method: string, path: string, doc: RouteDoc) {
  const pathParameters = [...path.matchAll(/:(\w+)/g)].map(([, name]) => ({ name, in: 'path', required: true, schema: { type: 'string' } }));
  const parameters = [...pathParameters, ...(doc.query ? queryParameters(doc.query) : [])];
  const success = method === 'POST' && /\(201\)/.test(doc.answer) ? '201' : doc.answer === '204' ? '204' : '200';
  return {
    summary: doc.summary,
    description: `Who: ${doc.who}. Answer: ${doc.answer}.`,
    ...(doc.who === 'anyone' ? { security: [] } : {}),
    ...(parameters.length ? { parameters } : {}),
    ...(doc.body ? { requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(doc.body) } } } } : {}),
    ...(doc.upload ? { requestBody: uploadBody(doc.upload) } : {}),
    responses: {
      [success]: { description: doc.answer, ...(doc.produces ? { content: { [doc.produces]: {} } } : {}) },
      '400': { description: 'Invalid input: names each field (or CSV row and column) and what is allowed', content: errorContent },
      ...(doc.who === 'anyone' ? {} : { '401': { description: 'Not signed in', content: errorContent } }),
      '403': { description: 'Missing CSRF token on a write, or a role that may not do this', content: errorContent },
    },
  };
}

/** OpenAPI 3.1 description of every API route, built from the route table and the zod schemas that validate them. */
export function buildOpenApiDocument() {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const [key, doc] of Object.entries(ROUTE_DOCS)) {
    const [method, fullPath] = key.split(' ') as [string, string];
    const path = fullPath.replace(/^\/api/, '');
    const openApiPath = path.replace(/:(\w+)/g, '{$1}');
    (paths[openApiPath] ??= {})[method.toLowerCase()] = operation(method, path, doc);
  }
  return {
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
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'gapwright.sid' } },
      schemas: { Error: errorSchema },
    },
    paths,
  };
}
