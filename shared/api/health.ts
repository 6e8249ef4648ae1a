import * as z from 'zod';
import { healthResponseSchema } from '@shared/schemas/health';
import { defineEndpoint } from './endpoint';

export const health = defineEndpoint({
  method: 'GET',
  path: '/health',
  access: 'anyone',
  answer: healthResponseSchema,
  summary: 'Liveness and database reachability (answers even when the database is down)',
  description: '503 with the same body when the database cannot be reached.',
});

export const openApiDocument = defineEndpoint({
  method: 'GET',
  path: '/openapi.json',
  access: 'anyone',
  answer: z.record(z.string(), z.unknown()),
  summary: 'This document (OpenAPI 3.1)',
});
