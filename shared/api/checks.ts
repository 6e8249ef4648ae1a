import * as z from 'zod';
import { revisionCheckSchema, revisionChecksSchema, runCheckRequestSchema } from '@shared/schemas/checks';
import { defineEndpoint } from './endpoint';
import { positiveIdSchema, revisionParamsSchema } from './params';

const checkParamsSchema = z.object({ id: positiveIdSchema, rev: positiveIdSchema, checkId: positiveIdSchema });
const FROZEN = 'A released revision’s checks are frozen with it (409); a revision without saved figures answers 409.';

export const runCheck = defineEndpoint({
  method: 'POST',
  path: '/designs/:id/revisions/:rev/checks',
  access: 'library',
  params: revisionParamsSchema,
  body: runCheckRequestSchema,
  answer: revisionCheckSchema,
  status: 202,
  summary: 'Queue an independent check of a saved revision (worked by a check worker)',
  description: `${FROZEN} One check of a kind may be queued or running per revision: asking again answers that one.`,
});

export const listChecks = defineEndpoint({
  method: 'GET',
  path: '/designs/:id/revisions/:rev/checks',
  access: 'library',
  params: revisionParamsSchema,
  answer: revisionChecksSchema,
  summary: 'The latest check of each kind on a revision: status, progress, result or the reason it failed',
});

export const cancelCheck = defineEndpoint({
  method: 'POST',
  path: '/designs/:id/revisions/:rev/checks/:checkId/cancel',
  access: 'library',
  params: checkParamsSchema,
  answer: revisionCheckSchema,
  summary: 'Cancel a queued or running check; a running one’s result is discarded',
  description: 'A check that has already finished answers 409.',
});
