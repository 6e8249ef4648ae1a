// One entry per API route not yet declared in shared/api (see DEVELOPERS.md, "Declaring an API route"): what it does, who may call it, and the zod schema of its JSON body or query
// (the same schema the route validates with). `tests/api/openapi.test.ts` fails when a route is missing here.
import type * as z from 'zod';
import { coreLossRequestSchema, evaluateRequestSchema, operatingPointRequestSchema, searchRequestSchema } from '@shared/schemas/calc';
import { compareCurvesRequestSchema, compareDesignRequestSchema, compareSavedDesignRequestSchema } from '@shared/schemas/compare';
import { userCoreRequestSchema } from '@shared/schemas/cores';
import { materialEditSchema, materialExportQuerySchema } from '@shared/schemas/materials';
import { unitMeasurementSchema } from '@shared/schemas/review';

export interface RouteDoc {
  summary: string;
  /** Who passes the access check: "anyone", "signed in", or the roles. */
  who: string;
  body?: z.ZodType;
  query?: z.ZodType;
  /** A CSV file upload (multipart field `file`, plus `decisions` on commit). */
  upload?: 'preview' | 'commit';
  /** What a successful answer carries. */
  answer: string;
  /** Non-JSON answers. */
  produces?: 'text/csv' | 'application/pdf' | 'application/octet-stream';
}

const SIGNED_IN = 'signed in';
const UPLOADERS = 'engineer, reviewer, admin';
const CURATORS = 'reviewer, admin';

export const ROUTE_DOCS: Record<string, RouteDoc> = {
  'POST /api/calc/operating-point': {
    summary: 'Buck operating point: duty range, inductance, ripple, peak and RMS current, energy, CCM boundary, ripple harmonics',
    who: SIGNED_IN,
    body: operatingPointRequestSchema,
    answer: '{ dutyAtVinMin, dutyAtVinMax, inductance, ripplePeakToPeak, peakCurrent, rmsCurrent, energy, ccmBoundaryCurrent, harmonics: [{ n, amplitude }], … }',
  },
  'POST /api/calc/core-loss': { summary: 'Core-loss density by Steinmetz (peak B = ΔB/2) and iGSE', who: SIGNED_IN, body: coreLossRequestSchema, answer: '{ steinmetz, igse } in W/m³' },
  'POST /api/calc/search': {
    summary: 'Ranked candidates over catalogue cores × materials × wire options, with the Pareto front and reasons for infeasible ones',
    who: SIGNED_IN,
    body: searchRequestSchema,
    answer: 'SearchResult',
  },
  'POST /api/calc/evaluate': {
    summary: 'Every figure of one explicit design (add ?sweep=frequency for a loss-versus-frequency sweep)',
    who: SIGNED_IN,
    body: evaluateRequestSchema,
    answer: '{ wire, result, lossVersusFrequency? }',
  },
  'POST /api/compare/curves': {
    summary: 'Core-loss density of several materials over a frequency sweep and a ΔB sweep, fitted ranges and extrapolated points marked',
    who: SIGNED_IN,
    body: compareCurvesRequestSchema,
    answer: '{ deltaB, frequency, duty, materials: [{ id, name, fit, versusFrequency, versusFlux }] }',
  },
  'POST /api/compare/design': {
    summary: 'One unsaved design (core, turns, wire) with every current material; gap re-solved per material',
    who: SIGNED_IN,
    body: compareDesignRequestSchema,
    answer: '{ engineVersion, coreId, turns, rows: [{ materialId, status, coreLoss, totalLoss, … }] }',
  },
  'POST /api/compare/saved-design': {
    summary:
      'A saved revision with every current material and its own material version (usedByDesign); 404 for an unknown design or revision, 409 when the revision has no construction',
    who: SIGNED_IN,
    body: compareSavedDesignRequestSchema,
    answer: '{ engineVersion, design, coreId, turns, rows }',
  },

  'GET /api/catalogue/cores/:id/history': { summary: 'Every version of a user core, newest first', who: SIGNED_IN, answer: '{ versions }' },
  'POST /api/catalogue/cores': { summary: 'Add a user core: a ring from dimensions (IEC 60205) or a gapped set from effective parameters', who: UPLOADERS, body: userCoreRequestSchema, answer: 'the listed core (201)' },
  'GET /api/catalogue/cores/template.csv': { summary: 'Core CSV template: two invented, illustrative rows', who: SIGNED_IN, answer: 'CSV', produces: 'text/csv' },
  'POST /api/catalogue/cores/import/preview': { summary: 'Every row of a core CSV file with its status and problems by column; nothing written', who: UPLOADERS, upload: 'preview', answer: '{ fileName, rows, summary }' },
  'POST /api/catalogue/cores/import/commit': { summary: 'All rows of a core CSV file in one transaction, or none', who: UPLOADERS, upload: 'commit', answer: '{ fileName, created, versioned, skipped, coreIds } (201)' },
  'PUT /api/catalogue/cores/:id': { summary: 'A new version of a current user core', who: UPLOADERS, body: userCoreRequestSchema, answer: 'the listed core (201)' },
  'POST /api/catalogue/cores/:id/retire': { summary: 'Hide a user core from new searches (designs keep it)', who: CURATORS, answer: 'the listed core' },
  'POST /api/catalogue/cores/:id/unretire': { summary: 'Bring a retired user core back', who: CURATORS, answer: 'the listed core' },

  'GET /api/materials': { summary: 'Current materials in SI units (?retired=include for retired ones too)', who: SIGNED_IN, answer: '{ materials }' },
  'GET /api/materials/library': { summary: 'Current versions with author, unit set, uploaded k and CSV cells', who: SIGNED_IN, answer: '{ materials }' },
  'GET /api/materials/template.csv': { summary: 'Material CSV template: two invented, illustrative materials', who: SIGNED_IN, answer: 'CSV', produces: 'text/csv' },
  'GET /api/materials/export.csv': { summary: 'The library or the materials named by ids, formula-like cells escaped', who: SIGNED_IN, query: materialExportQuerySchema, answer: 'CSV', produces: 'text/csv' },
  'GET /api/materials/imports': { summary: 'Who uploaded which material file and what it did', who: SIGNED_IN, answer: '{ imports }' },
  'GET /api/materials/:id/history': { summary: 'Every version of a material, newest first', who: SIGNED_IN, answer: '{ versions }' },
  'POST /api/materials/import/preview': { summary: 'Every row of a material CSV file with its status and problems by column; nothing written', who: UPLOADERS, upload: 'preview', answer: '{ fileName, rows, summary }' },
  'POST /api/materials/import/commit': { summary: 'All rows of a material CSV file in one transaction, or none', who: UPLOADERS, upload: 'commit', answer: '{ importId, created, versioned, skipped, materialIds } (201)' },
  'PATCH /api/materials/:id': { summary: 'Changed cells (CSV column names, the row’s own unit set) make a new version', who: UPLOADERS, body: materialEditSchema, answer: 'the material (201)' },
  'POST /api/materials/:id/retire': { summary: 'Hide a material from new searches (designs keep it)', who: CURATORS, answer: 'the material' },
  'POST /api/materials/:id/unretire': { summary: 'Bring a retired material back', who: CURATORS, answer: 'the material' },


  'GET /api/shop/orders': { summary: 'Build orders (?status=open|complete|all)', who: 'winder, reviewer, engineer, admin', answer: '{ orders }' },
  'GET /api/shop/orders/:id': { summary: 'One build order with its frozen winding sheet and the units recorded', who: 'winder, reviewer, engineer, admin', answer: 'BuildOrder' },
  'GET /api/shop/orders/:id/sheet.pdf': { summary: 'The winding sheet as PDF', who: 'winder, reviewer, engineer, admin', answer: 'PDF', produces: 'application/pdf' },
  'POST /api/shop/orders/:id/units': { summary: 'Record one built unit: measured L, DCR at a temperature, hipot; pass/fail per check', who: 'winder', body: unitMeasurementSchema, answer: 'the unit (201)' },
  'GET /api/shop/prediction-report': { summary: 'Measured against predicted L and DCR by material and core', who: 'engineer, reviewer, admin', answer: '{ units, byMaterial, byCore }' },
};
