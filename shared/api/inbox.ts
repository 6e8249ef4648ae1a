import { inboxResponseSchema } from '@shared/schemas/inbox';
import { defineEndpoint } from './endpoint';

export const inbox = defineEndpoint({
  method: 'GET',
  path: '/inbox',
  access: 'signedIn',
  answer: inboxResponseSchema,
  summary: 'What waits for the caller: revisions to review, returned drafts, build orders',
});
