import * as z from 'zod';
import { EXPORT_KINDS } from '@shared/schemas/designs';
import { defineEndpoint } from './endpoint';
import { revisionParamsSchema } from './params';

export const exportRevision = defineEndpoint({
  method: 'GET',
  path: '/designs/:id/revisions/:rev/exports/:kind',
  access: 'signedIn',
  // An unknown kind is a missing file (404), so the handler, not the schema, checks it.
  params: revisionParamsSchema.extend({ kind: z.string().meta({ description: `One of ${EXPORT_KINDS.join(', ')}` }) }),
  answer: z.void(),
  produces: 'application/octet-stream',
  summary: 'design.json (re-importable), candidates.csv, bom.csv or spice.lib of a saved revision',
  description: 'An unknown kind answers 404; a revision without a chosen construction answers 409 for bom.csv and spice.lib.',
});
