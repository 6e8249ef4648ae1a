import {
  releaseRequestSchema,
  returnRequestSchema,
  timelineSchema,
  transitionOutcomeSchema,
  transitionRequestSchema,
} from '@shared/schemas/review';
import { defineEndpoint } from './endpoint';
import { idParamsSchema } from './params';

// `:id` is the revision's database id. The service checks ownership and state: 403 for the wrong person,
// 409 for the wrong state.

export const revisionTimeline = defineEndpoint({
  method: 'GET',
  path: '/revisions/:id/timeline',
  access: 'signedIn',
  params: idParamsSchema,
  answer: timelineSchema,
  summary: 'Review steps of the design’s revisions with who, when and comments',
});

export const submitRevision = defineEndpoint({
  method: 'POST',
  path: '/revisions/:id/submit',
  access: 'design',
  params: idParamsSchema,
  body: transitionRequestSchema,
  answer: transitionOutcomeSchema,
  summary: 'Submit a draft for review (owner only)',
});

export const approveRevision = defineEndpoint({
  method: 'POST',
  path: '/revisions/:id/approve',
  access: 'review',
  params: idParamsSchema,
  body: transitionRequestSchema,
  answer: transitionOutcomeSchema,
  summary: 'Approve a revision in review (never the author)',
});

export const returnRevision = defineEndpoint({
  method: 'POST',
  path: '/revisions/:id/return',
  access: 'review',
  params: idParamsSchema,
  body: returnRequestSchema,
  answer: transitionOutcomeSchema,
  summary: 'Return a revision to its author with a comment',
});

export const releaseRevision = defineEndpoint({
  method: 'POST',
  path: '/revisions/:id/release',
  access: 'review',
  params: idParamsSchema,
  body: releaseRequestSchema,
  answer: transitionOutcomeSchema,
  summary: 'Release an approved revision: freezes it, writes the winding sheet and build order, mails the shop',
});
