import {
  copyDesignRequestSchema,
  createDesignRequestSchema,
  designDetailSchema,
  designFileSchema,
  designListQuerySchema,
  designListResponseSchema,
  newRevisionRequestSchema,
  revisionDetailSchema,
  revisionDiffQuerySchema,
  revisionDiffSchema,
  updateRevisionRequestSchema,
} from '@shared/schemas/designs';
import { defineEndpoint } from './endpoint';
import { idParamsSchema, revisionParamsSchema } from './params';

const OWNER_ONLY = 'Only the design’s owner may (403 otherwise); a revision that is no longer a draft answers 409.';

export const listDesigns = defineEndpoint({
  method: 'GET',
  path: '/designs',
  access: 'signedIn',
  query: designListQuerySchema,
  answer: designListResponseSchema,
  summary: 'Designs, searched, sorted and paged',
});

export const createDesign = defineEndpoint({
  method: 'POST',
  path: '/designs',
  access: 'design',
  body: createDesignRequestSchema,
  answer: designDetailSchema,
  status: 201,
  summary: 'A new design (revision 1, draft) owned by the caller; the construction is evaluated',
});

export const importDesign = defineEndpoint({
  method: 'POST',
  path: '/designs/import',
  access: 'design',
  body: designFileSchema,
  answer: designDetailSchema,
  status: 201,
  summary: 'A new design from an exported design file (results recomputed, never trusted)',
});

export const getDesign = defineEndpoint({
  method: 'GET',
  path: '/designs/:id',
  access: 'signedIn',
  params: idParamsSchema,
  answer: designDetailSchema,
  summary: 'A design with its revisions and the latest revision in full, and what the caller may do with each',
});

export const copyDesign = defineEndpoint({
  method: 'POST',
  path: '/designs/:id/copy',
  access: 'design',
  params: idParamsSchema,
  body: copyDesignRequestSchema,
  answer: designDetailSchema,
  status: 201,
  summary: 'A copy owned by the caller',
});

export const diffRevisions = defineEndpoint({
  method: 'GET',
  path: '/designs/:id/diff',
  access: 'signedIn',
  params: idParamsSchema,
  query: revisionDiffQuerySchema,
  answer: revisionDiffSchema,
  summary: 'Differences between two revisions (spec, construction, results)',
});

export const newRevision = defineEndpoint({
  method: 'POST',
  path: '/designs/:id/revisions',
  access: 'design',
  params: idParamsSchema,
  body: newRevisionRequestSchema,
  answer: revisionDetailSchema,
  status: 201,
  summary: 'A new draft revision from the latest or a given one (owner only)',
  description: OWNER_ONLY,
});

export const getRevision = defineEndpoint({
  method: 'GET',
  path: '/designs/:id/revisions/:rev',
  access: 'signedIn',
  params: revisionParamsSchema,
  answer: revisionDetailSchema,
  summary: 'One revision in full, and what the caller may do with it',
});

export const updateRevision = defineEndpoint({
  method: 'PATCH',
  path: '/designs/:id/revisions/:rev',
  access: 'design',
  params: revisionParamsSchema,
  body: updateRevisionRequestSchema,
  answer: revisionDetailSchema,
  summary: 'Change a draft revision (owner only); the construction is evaluated again',
  description: OWNER_ONLY,
});
