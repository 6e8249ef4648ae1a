import * as z from 'zod';
import { outboxResponseSchema } from '@shared/schemas/outbox';
import { defineEndpoint } from './endpoint';
import { positiveIdSchema } from './params';

export const outbox = defineEndpoint({
  method: 'GET',
  path: '/admin/outbox',
  access: 'admin',
  answer: outboxResponseSchema,
  summary: 'Mail sent to the winding shop and its delivery state',
});

export const outboxAttachment = defineEndpoint({
  method: 'GET',
  path: '/admin/outbox/:id/attachments/:index',
  access: 'admin',
  // index counts from 1, as the outbox lists attachments.
  params: z.object({ id: positiveIdSchema, index: positiveIdSchema }),
  answer: z.void(),
  produces: 'application/octet-stream',
  summary: 'One attachment of a sent mail (the winding sheet PDF)',
});
