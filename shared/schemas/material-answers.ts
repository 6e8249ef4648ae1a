// What the material routes answer: the engine's material, the listed version, the library entry with its
// cells and what the user may do with it, the upload log and an import's result.
import * as z from 'zod';
import { MATERIAL_FAMILIES, type CoreMaterial } from '@shared/engine/types';
import { MATERIAL_CSV_COLUMNS, MATERIAL_UNIT_SETS } from './material-csv';
import { recordActionsSchema } from './record-actions';

/** The engine's CoreMaterial as an answer carries it. */
export const coreMaterialSchema = z.object({
  id: z.string(),
  name: z.string(),
  family: z.enum(MATERIAL_FAMILIES),
  k: z.number(),
  alpha: z.number(),
  beta: z.number(),
  fitFrequencyMin: z.number(),
  fitFrequencyMax: z.number(),
  fitFluxMin: z.number(),
  fitFluxMax: z.number(),
  // As the engine uses them: a material with t_ref has them divided by their factor at t_ref (factor(t_ref) = 1).
  tempCoefficients: z.object({ ct0: z.number(), ct1: z.number(), ct2: z.number() }).optional(),
  bsat25: z.number(),
  bsat100: z.number(),
  permeability: z.number(),
  rollOff: z.object({ a: z.number(), b: z.number(), c: z.number() }).optional(),
  biasLoss: z
    .object({
      doublingField: z.number().meta({ description: 'H₂, A/m: the DC field at which core loss has doubled' }),
      steepness: z.number(),
    })
    .optional()
    .meta({ description: 'Core loss under DC bias: factor 1 + (H/H₂)^m' }),
  density: z.number(),
  maxTemperature: z.number().optional(),
}) satisfies z.ZodType<CoreMaterial>;

/** A stored material version as GET /api/materials lists it: the engine's fields plus version, provenance and state. */
export const materialSummarySchema = coreMaterialSchema.extend({
  lineage: z.string(),
  version: z.number().int(),
  retired: z.boolean(),
  unitSet: z.enum(MATERIAL_UNIT_SETS),
  kUploaded: z.number(),
  referenceTemperature: z.number().nullable(),
  /** The stored temperature behaviour F0 + c·(T − T0)² as given (not referred to t_ref), or null. */
  temperatureBehaviour: z
    .object({
      lowestLossTemperature: z.number().meta({ description: 'T0, °C' }),
      lowestLossFactor: z.number().meta({ description: 'F0, the loss factor at T0' }),
      curvature: z.number().meta({ description: 'c, 1/K²' }),
    })
    .nullable(),
  /** The stored powder roll-off μ/μi = 1/(1 + (H/H½)ⁿ), or null. */
  rollOffCurve: z
    .object({ halfField: z.number().meta({ description: 'H½, A/m' }), steepness: z.number().meta({ description: 'n' }) })
    .nullable(),
  provenance: z.string(),
  createdAt: z.string(),
});
export type MaterialSummary = z.infer<typeof materialSummarySchema>;
export const materialListResponseSchema = z.object({ materials: z.array(materialSummarySchema) });

/** What the library shows of a version's loss points and temperature behaviour (figures, not cells). */
export const materialDataSchema = z.object({
  lossPointCount: z.number().int().meta({ description: 'Loss points stored with this version' }),
  fitQuality: z
    .object({
      rmsRelativeError: z.number(),
      worstRelativeError: z.number().meta({ description: 'Largest |engine loss / measured − 1| over the points' }),
      pointCount: z.number().int().meta({ description: 'Points within the fitted frequency and flux ranges, the ones judged' }),
    })
    .nullable()
    .meta({
      description:
        "The stored k, α, β and temperature factor against the version's own points within its fitted ranges, as the engine computes loss; null without points there",
    }),
  lowestLossTemperature: z
    .number()
    .nullable()
    .meta({ description: 'Temperature of lowest core loss (°C); null without a temperature behaviour that has one' }),
});
export type MaterialData = z.infer<typeof materialDataSchema>;

/**
 * A material as the library lists it (GET /api/materials/library, history, edits): with author, its CSV cells,
 * its loss-point figures and what the signed-in user may do with it.
 */
export const libraryMaterialSchema = materialSummarySchema
  .extend({
    current: z.boolean(),
    createdBy: z.string().nullable(),
    cells: z.record(z.enum(MATERIAL_CSV_COLUMNS), z.string()),
  })
  .extend(materialDataSchema.shape)
  .extend(recordActionsSchema.shape);
export type LibraryMaterial = z.infer<typeof libraryMaterialSchema>;
/** The library, and whether the signed-in user may upload material files. */
export const libraryResponseSchema = z.object({ materials: z.array(libraryMaterialSchema), canImport: z.boolean() });
export const materialHistoryResponseSchema = z.object({ versions: z.array(libraryMaterialSchema) });

/** One uploaded material CSV file and what it did. */
export const materialImportEntrySchema = z.object({
  id: z.number().int(),
  fileName: z.string(),
  uploadedBy: z.string().nullable(),
  uploadedAt: z.string(),
  rowCount: z.number().int(),
  createdCount: z.number().int(),
  versionedCount: z.number().int(),
  skippedCount: z.number().int(),
});
export type MaterialImportEntry = z.infer<typeof materialImportEntrySchema>;
export const materialImportsResponseSchema = z.object({ imports: z.array(materialImportEntrySchema) });

/** What a committed material CSV import did. */
export const materialCommitResultSchema = z.object({
  importId: z.number().int(),
  created: z.number().int(),
  versioned: z.number().int(),
  skipped: z.number().int(),
  materialIds: z.array(z.number().int()),
});
export type MaterialCommitResult = z.infer<typeof materialCommitResultSchema>;
