import * as z from 'zod';
import { importPreviewSchema } from '@shared/schemas/csv-import';
import {
  libraryMaterialSchema,
  libraryResponseSchema,
  materialCommitResultSchema,
  materialHistoryResponseSchema,
  materialImportsResponseSchema,
  materialListResponseSchema,
} from '@shared/schemas/material-answers';
import { materialEditSchema, materialExportQuerySchema, materialListQuerySchema } from '@shared/schemas/material-requests';
import { defineEndpoint } from './endpoint';
import { idParamsSchema } from './params';

export const listMaterials = defineEndpoint({
  method: 'GET',
  path: '/materials',
  access: 'signedIn',
  query: materialListQuerySchema,
  answer: materialListResponseSchema,
  summary: 'Current materials in SI units (?retired=include for retired ones too)',
});

export const materialLibrary = defineEndpoint({
  method: 'GET',
  path: '/materials/library',
  access: 'signedIn',
  answer: libraryResponseSchema,
  summary: 'Current versions with author, unit set, uploaded k and CSV cells',
});

export const materialTemplate = defineEndpoint({
  method: 'GET',
  path: '/materials/template.csv',
  access: 'signedIn',
  answer: z.void(),
  produces: 'text/csv',
  summary: 'Material CSV template: two invented, illustrative materials',
});

export const exportMaterials = defineEndpoint({
  method: 'GET',
  path: '/materials/export.csv',
  access: 'signedIn',
  query: materialExportQuerySchema,
  answer: z.void(),
  produces: 'text/csv',
  summary: 'The library or the materials named by ids, formula-like cells escaped',
});

export const materialImports = defineEndpoint({
  method: 'GET',
  path: '/materials/imports',
  access: 'signedIn',
  answer: materialImportsResponseSchema,
  summary: 'Who uploaded which material file and what it did',
});

export const previewMaterialImport = defineEndpoint({
  method: 'POST',
  path: '/materials/import/preview',
  access: 'upload',
  upload: 'preview',
  answer: importPreviewSchema,
  summary: 'Every row of a material CSV file with its status and problems by column; nothing written',
});

export const commitMaterialImport = defineEndpoint({
  method: 'POST',
  path: '/materials/import/commit',
  access: 'upload',
  upload: 'commit',
  answer: materialCommitResultSchema,
  status: 201,
  summary: 'All rows of a material CSV file in one transaction, or none',
});

export const materialHistory = defineEndpoint({
  method: 'GET',
  path: '/materials/:id/history',
  access: 'signedIn',
  params: idParamsSchema,
  answer: materialHistoryResponseSchema,
  summary: 'Every version of a material, newest first',
});

export const editMaterial = defineEndpoint({
  method: 'PATCH',
  path: '/materials/:id',
  access: 'upload',
  params: idParamsSchema,
  body: materialEditSchema,
  answer: libraryMaterialSchema,
  status: 201,
  summary: 'Changed cells (CSV column names, the row’s own unit set) make a new version',
});

export const retireMaterial = defineEndpoint({
  method: 'POST',
  path: '/materials/:id/retire',
  access: 'curate',
  params: idParamsSchema,
  answer: libraryMaterialSchema,
  summary: 'Hide a material from new searches (designs keep it)',
});

export const unretireMaterial = defineEndpoint({
  method: 'POST',
  path: '/materials/:id/unretire',
  access: 'curate',
  params: idParamsSchema,
  answer: libraryMaterialSchema,
  summary: 'Bring a retired material back',
});
