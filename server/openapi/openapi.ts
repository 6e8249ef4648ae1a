import * as z from 'zod';
import { coreLossRequestSchema, evaluateRequestSchema, operatingPointRequestSchema, searchRequestSchema } from '@shared/schemas/calc';
import { compareCurvesRequestSchema, compareDesignRequestSchema, compareSavedDesignRequestSchema } from '@shared/schemas/compare';
import { ENGINE_VERSION } from '@shared/engine/index';
import { APP_VERSION } from '../health/health.router.ts';

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

const requestSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' });

function operation(summary: string, schema: z.ZodType, response: string) {
  return {
    summary,
    security: [{ session: [] }],
    requestBody: { required: true, content: { 'application/json': { schema: requestSchema(schema) } } },
    responses: {
      '200': { description: response },
      '400': { description: 'Invalid input: names each field and its allowed range', content: { 'application/json': { schema: errorSchema } } },
      '401': { description: 'Not signed in', content: { 'application/json': { schema: errorSchema } } },
      '403': { description: 'Missing CSRF token', content: { 'application/json': { schema: errorSchema } } },
    },
  };
}

/** OpenAPI 3.1 description of the calculation API, generated from the zod schemas that validate it. */
export function buildOpenApiDocument() {
  return {
    openapi: '3.1.0',
    info: {
      title: 'Gapwright calculation and comparison API',
      version: APP_VERSION,
      description:
        `Buck-inductor calculations (engine ${ENGINE_VERSION}). JSON in SI units: V, A, Hz, H, T, m, W, W/m³; temperatures in °C. ` +
        'Results are engineering estimates that need qualified review. Writes need the session cookie and the X-XSRF-TOKEN header ' +
        '(the value of the XSRF-TOKEN cookie set by GET /api/auth/session).',
    },
    servers: [{ url: '/api' }],
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'gapwright.sid' } },
      schemas: { Error: errorSchema },
    },
    paths: {
      '/calc/operating-point': {
        post: operation(
          'Buck operating point: duty range, inductance, ripple, peak and RMS current, energy, CCM boundary, ripple harmonics',
          operatingPointRequestSchema,
          '{ dutyAtVinMin, dutyAtVinMax, inductance, ripplePeakToPeak, peakCurrent, rmsCurrent, energy, ccmBoundaryCurrent, harmonics: [{ n, amplitude }], … }',
        ),
      },
      '/calc/core-loss': {
        post: operation('Core-loss density by Steinmetz (peak B = ΔB/2) and iGSE', coreLossRequestSchema, '{ steinmetz, igse } in W/m³'),
      },
      '/calc/search': {
        post: operation('Ranked candidates over catalogue cores × materials × wire options, with the Pareto front and reasons for infeasible ones', searchRequestSchema, 'SearchResult'),
      },
      '/calc/evaluate': {
        post: operation('Every figure of one explicit design (add ?sweep=frequency for a loss-versus-frequency sweep)', evaluateRequestSchema, '{ wire, result, lossVersusFrequency? }'),
      },
      '/compare/curves': {
        post: operation('Core-loss density of several materials over a frequency sweep and a ΔB sweep, fitted ranges and extrapolated points marked', compareCurvesRequestSchema, '{ deltaB, frequency, duty, materials: [{ id, name, fit, versusFrequency, versusFlux }] }'),
      },
      '/compare/design': {
        post: operation('One unsaved design (core, turns, wire) with every current material; gap re-solved per material', compareDesignRequestSchema, '{ engineVersion, coreId, turns, rows: [{ materialId, status, coreLoss, totalLoss, … }] }'),
      },
      '/compare/saved-design': {
        post: operation(
          'A saved revision with every current material and its own material version (usedByDesign); 404 for an unknown design or revision, 409 when the revision has no construction',
          compareSavedDesignRequestSchema,
          '{ engineVersion, design, coreId, turns, rows }',
        ),
      },
    },
  };
}
