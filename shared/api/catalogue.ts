import * as z from 'zod';
import { importPreviewSchema } from '@shared/schemas/csv-import';
import {
  coreHistoryResponseSchema,
  coreImportResultSchema,
  coreListResponseSchema,
  listedCoreSchema,
  userCoreRequestSchema,
} from '@shared/schemas/cores';
import { defineEndpoint } from './endpoint';
import { idParamsSchema } from './params';

export const listCores = defineEndpoint({
  method: 'GET',
  path: '/catalogue/cores',
  access: 'signedIn',
  answer: coreListResponseSchema,
  summary: 'Shipped cores and current user cores (SI units, Ap, origin, version)',
});

export const userCoreHistory = defineEndpoint({
  method: 'GET',
  path: '/catalogue/cores/:id/history',
  access: 'signedIn',
  params: idParamsSchema,
  answer: coreHistoryResponseSchema,
  summary: 'Every version of a user core, newest first',
});

export const createUserCore = defineEndpoint({
  method: 'POST',
  path: '/catalogue/cores',
  access: 'upload',
  body: userCoreRequestSchema,
  answer: listedCoreSchema,
  status: 201,
  summary: 'Add a user core: a ring from dimensions (IEC 60205) or a gapped set from effective parameters',
});

export const coreTemplate = defineEndpoint({
  method: 'GET',
  path: '/catalogue/cores/template.csv',
  access: 'signedIn',
  answer: z.void(),
  produces: 'text/csv',
  summary: 'Core CSV template: two invented, illustrative rows',
});

export const previewCoreImport = defineEndpoint({
  method: 'POST',
  path: '/catalogue/cores/import/preview',
  access: 'upload',
  upload: 'preview',
  answer: importPreviewSchema,
  summary: 'Every row of a core CSV file with its status and problems by column; nothing written',
});

export const commitCoreImport = defineEndpoint({
  method: 'POST',
  path: '/catalogue/cores/import/commit',
  access: 'upload',
  upload: 'commit',
  answer: coreImportResultSchema,
  status: 201,
  summary: 'All rows of a core CSV file in one transaction, or none',
});

export const editUserCore = defineEndpoint({
  method: 'PUT',
  path: '/catalogue/cores/:id',
  access: 'upload',
  params: idParamsSchema,
  body: userCoreRequestSchema,
  answer: listedCoreSchema,
  status: 201,
  summary: 'A new version of a current user core',
});

export const retireUserCore = defineEndpoint({
  method: 'POST',
  path: '/catalogue/cores/:id/retire',
  access: 'curate',
  params: idParamsSchema,
  answer: listedCoreSchema,
  summary: 'Hide a user core from new searches (designs keep it)',
});

export const unretireUserCore = defineEndpoint({
  method: 'POST',
  path: '/catalogue/cores/:id/unretire',
  access: 'curate',
  params: idParamsSchema,
  answer: listedCoreSchema,
  summary: 'Bring a retired user core back',
});
