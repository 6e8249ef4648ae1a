// The frozen winding sheet as stored with a build order and sent to the client, tied to its type in
// shared/shop/sheet.ts (`satisfies`), so the builder, the stored JSON, the answer and the client agree.
import * as z from 'zod';
import { CORE_FAMILIES, GAP_PLACEMENTS, WIRE_KINDS } from '@shared/engine/types';
import type { SheetTestLimits, WindingSheet } from '@shared/shop/sheet';
import type { WindingDrawingInput } from '@shared/shop/winding-drawing';

export const sheetTestLimitsSchema = z.object({
  inductance: z.object({
    nominal: z.number().meta({ description: 'H' }),
    min: z.number().meta({ description: 'H' }),
    max: z.number().meta({ description: 'H' }),
    testFrequency: z.number().meta({ description: 'Small-signal test frequency (Hz), no DC bias' }),
    testLevel: z.number().meta({ description: 'Test level (V rms)' }),
    reactance: z.number().optional().meta({ description: '2πfL at the test frequency (Ω)' }),
    resolution: z.number().optional().meta({ description: 'What the meter must resolve (Ω)' }),
    testFlux: z.number().optional().meta({ description: 'Peak flux the test level drives (T)' }),
  }),
  resistanceMax20: z
    .number()
    .meta({ description: 'Largest DC resistance at 20 °C at the pins: winding, leads and joints with the allowance (Ω)' }),
  resistance: z
    .object({
      winding: z.number().meta({ description: 'Winding DC resistance at 20 °C (Ω)' }),
      leads: z.number().meta({ description: 'Both leads at 20 °C (Ω)' }),
      terminations: z.number().meta({ description: 'Both termination joints (Ω)' }),
      tolerance: z.number(),
      max: z.number().meta({ description: 'Ω at 20 °C' }),
      fourWire: z.boolean().meta({ description: 'Measure four-wire (Kelvin) at the pins' }),
    })
    .optional(),
  biasInductance: z
    .object({
      current: z.number().meta({ description: 'DC bias current (A)' }),
      predicted: z.number().meta({ description: 'Predicted L at that current (H)' }),
      min: z.number().meta({ description: 'Smallest L at that current (H)' }),
      fractionOfNominal: z.number(),
    })
    .nullable()
    .optional()
    .meta({ description: 'Inductance under DC bias where saturation matters; null where not asked for' }),
  hipot: z.object({ required: z.boolean(), instruction: z.string() }),
}) satisfies z.ZodType<SheetTestLimits>;

const metres = z.number().meta({ description: 'm' });

/** What the sheet's winding drawing is drawn from (shared/shop/winding-drawing.ts). */
export const windingDrawingInputSchema = z.object({
  family: z.enum(CORE_FAMILIES),
  turns: z.number().int(),
  layers: z.number(),
  turnsPerLayer: z.number().int(),
  wire: z.object({
    kind: z.enum(WIRE_KINDS),
    strandDiameter: metres,
    overallDiameter: metres,
    conductorsPerTurn: z.number().int(),
  }),
  keepOut: metres.nullable(),
  gap: z.object({ placement: z.enum(GAP_PLACEMENTS), total: metres, spacer: metres }).nullable(),
  core: z.object({
    windowWidth: metres,
    windowHeight: metres,
    bobbinWidth: metres,
    bobbinHeight: metres,
    centreLeg: metres,
    outerLeg: metres,
    yoke: metres,
    ring: z.object({ od: metres, id: metres, height: metres }).nullable(),
  }),
}) satisfies z.ZodType<WindingDrawingInput>;

export const windingSheetSchema = z
  .object({
    header: z.object({
      designNumber: z.string(),
      title: z.string(),
      revision: z.number().int(),
      orderNumber: z.string(),
      quantity: z.number().int(),
      releasedAt: z.string(),
      author: z.string(),
      approver: z.string(),
      engineVersion: z.string(),
    }),
    parts: z.object({
      coreSet: z.string(),
      coreMaterial: z.string(),
      gap: z.object({
        kind: z.enum(['centre-leg ground', 'spacer under all legs', 'none (distributed gap)']),
        total: z.number().meta({ description: 'Total gap in the magnetic path (m): the ground gap, or twice the spacer' }),
        groundDepth: z.number().meta({ description: 'Centre-leg gap to grind (m); 0 for a spacer design' }),
        // Sheets frozen before the spacer placement existed are ground designs without these two figures.
        spacer: z.number().default(0).meta({ description: 'Spacer thickness of a spacer design (m); 0 otherwise' }),
        spacerAlternative: z
          .number()
          .meta({ description: 'Ground design: the spacer under all legs giving the same inductance (m); 0 otherwise' }),
        sensitivity10um: z.number().default(0).meta({ description: 'ΔL/L for 10 µm more ground gap or spacer' }),
        note: z.string(),
      }),
      bobbin: z.string(),
      wire: z.object({
        description: z.string(),
        kind: z.string(),
        strandDiameter: z.number().meta({ description: 'm' }),
        strands: z.number().int(),
        overallDiameter: z.number().meta({ description: 'm' }),
        grade: z.number().int().nullable(),
        length: z.number().meta({ description: 'One conductor in hand including both leads (m)' }),
        mass: z.number().meta({ description: 'Copper of all conductors in hand (kg)' }),
        conductorsInHand: z.number().int().optional(),
        totalLength: z.number().optional().meta({ description: 'All conductors in hand together (m)' }),
        leadLength: z.number().optional().meta({ description: 'Each lead (m)' }),
      }),
      tapes: z.array(z.string()),
    }),
    winding: z.object({
      startPin: z.string(),
      finishPin: z.string(),
      turns: z.number().int(),
      layers: z.number().int(),
      turnsPerLayer: z.number().int(),
      lastLayerTurns: z.number().int(),
      direction: z.string(),
      traverse: z.string(),
      interlayerTape: z.string(),
      margins: z.string(),
      outerWrap: z.string(),
      keepOut: z
        .number()
        .nullable()
        .optional()
        .meta({ description: 'Copper clearance from the centre leg and its gap (m); null without an air gap; absent on older sheets' }),
    }),
    terminations: z.array(z.string()),
    termination: z
      .object({
        kind: z.enum(['pins', 'strap', 'flying-leads', 'foil-tabs']),
        pinCount: z.number().int().meta({ description: 'Bobbin pins (an estimate by core family and size)' }),
        startPins: z.array(z.number().int()),
        finishPins: z.array(z.number().int()),
        perPin: z.number().int(),
        strapArea: z.number().meta({ description: 'Strap or lead cross-section (m²); 0 on pins' }),
      })
      .optional(),
    assembly: z.array(z.string()),
    impregnation: z.string(),
    tests: sheetTestLimitsSchema,
    marking: z.string(),
    predicted: z.object({
      inductanceNominal: z.number().meta({ description: 'H' }),
      resistance20: z.number().meta({ description: 'Ω at 20 °C' }),
      totalLoss: z.number().meta({ description: 'W' }),
      hotSpot: z.number().meta({ description: '°C' }),
      peakFlux: z.number().meta({ description: 'T' }),
      saturationAtHotSpot: z.number().meta({ description: 'T' }),
    }),
    caution: z.string(),
    drawing: windingDrawingInputSchema.nullable().optional().meta({
      description: 'What the winding drawing is drawn from; null without the core shape; absent on sheets released before drawings',
    }),
  })
  .meta({
    description: 'Built once at release from the revision’s frozen result; SI units, temperatures in °C',
  }) satisfies z.ZodType<WindingSheet>;
