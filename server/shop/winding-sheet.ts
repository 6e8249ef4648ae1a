import type { EvaluationResult } from '@shared/engine/index';
import type { CoreShape, WireOption } from '@shared/engine/types';
import { COPPER_DENSITY, LEAD_LENGTH, lengthWithLeads } from '@shared/shop/build-practice';
import { SHEET_CAUTION, type WindingSheet } from '@shared/shop/sheet';
import { gapSensitivityText } from '@shared/shop/sheet-text';
import { planTerminations } from '@shared/shop/terminations';
import { biasTest, inductanceTest, resistanceLimit } from '@shared/shop/test-limits';
import { windingDrawingInput } from '@shared/shop/winding-drawing';

// The choices of the trade (lead length, pins, test frequency and level, allowances) are in shared/shop/build-practice.ts.

export interface SheetInput {
  design: { number: string; title: string };
  revision: { revision: number; engineVersion: string; inductanceTolerance: number };
  order: { number: string; quantity: number; releasedAt: Date };
  author: string;
  approver: string;
  result: EvaluationResult;
  core: CoreShape | undefined;
  wire: WireOption;
  insulation: { required: boolean; hipotInstruction?: string };
}

const mm = (m: number, digits = 2) => `${(m * 1e3).toFixed(digits)} mm`;

function wireDescription(wire: WireOption, copperArea: number): string {
  if (wire.kind === 'foil')
    return `Copper foil ${mm(wire.strandDiameter, 3)} thick × ${mm(copperArea / wire.strandDiameter, 1)} wide, one turn per layer, interlayer film ${mm(wire.overallDiameter - wire.strandDiameter, 3)} between turns; edges deburred, leads brazed or soldered to the foil ends`;
  if (wire.kind === 'litz')
    return `Litz ${wire.strands} × ${mm(wire.strandDiameter, 3)} strands, bundle about ${mm(wire.overallDiameter)} over serving`;
  const grade = wire.grade ? `, IEC 60317 grade ${wire.grade}` : '';
  const size =
    wire.kind === 'awg' ? `${wire.id.split(' ×')[0]} (${mm(wire.strandDiameter, 3)} bare)` : `${mm(wire.strandDiameter, 3)} bare`;
  return `Enamelled round copper ${size}${grade}, ${wire.strands} in hand (max overall ${mm(wire.overallDiameter, 3)} each)`;
}

/** How much 10 µm either way moves L, in words. */
const sensitivityText = (r: EvaluationResult) => `${gapSensitivityText(r.gap.sensitivity10um)} (10 µm less raises it about as much)`;

/**
 * Exactly what to build: a ground centre gap (with the spacer that would give the same inductance, never half the
 * gap: a spacer makes two gaps in series, and half the ground gap gives clearly less inductance), or a spacer.
 */
function gapPart(r: EvaluationResult): WindingSheet['parts']['gap'] {
  const sensitivity10um = r.gap.sensitivity10um;
  if (r.core.gapKind !== 'air-gap' || r.gap.total <= 0) {
    const note = r.core.gapKind === 'air-gap' ? 'No gap: assemble the halves ungapped.' : 'No gap: the material sets the permeability.';
    return { kind: 'none (distributed gap)', total: 0, groundDepth: 0, spacer: 0, spacerAlternative: 0, sensitivity10um: 0, note };
  }
  if (r.gap.placement === 'spacer') {
    return {
      kind: 'spacer under all legs',
      total: r.gap.total,
      groundDepth: 0,
      spacer: r.gap.spacer,
      spacerAlternative: 0,
      sensitivity10um,
      note:
        `Spacer ${mm(r.gap.spacer, 3)} thick under all legs (non-magnetic, e.g. polyester film), two gaps in series ` +
        `(${mm(r.gap.total, 3)} in the magnetic path); no ground gap. ${sensitivityText(r)}.`,
    };
  }
  return {
    kind: 'centre-leg ground',
    total: r.gap.total,
    groundDepth: r.gap.total,
    spacer: 0,
    spacerAlternative: r.gap.spacer,
    sensitivity10um,
    note:
      `Grind the centre leg to a gap of ${mm(r.gap.total, 3)} (one half by ${mm(r.gap.total, 3)}, or each half by ` +
      `${mm(r.gap.total / 2, 3)}); ${sensitivityText(r)}. Only if the engineer agrees, the same inductance without ` +
      `grinding: a spacer ${mm(r.gap.spacer, 3)} thick under all legs (not half the gap; more stray field).`,
  };
}

/** The shop's sheet for one released revision, from its frozen result. Never recomputed afterwards. */
export function buildWindingSheet(input: SheetInput): WindingSheet {
  const { result: r, wire, core } = input;
  const gapped = r.core.gapKind === 'air-gap' && r.gap.total > 0;
  const spacer = gapped && r.gap.placement === 'spacer';
  const tol = input.revision.inductanceTolerance;
  const nominal = r.inductance.nominal;
  const copperArea = r.wire.copperArea;
  const wireLength = lengthWithLeads(r.winding.wireLength);
  // Litz and foil are one conductor each; round wires in hand are `strands` conductors.
  const inHand = wire.kind === 'litz' || wire.kind === 'foil' ? 1 : wire.strands;
  const plan = planTerminations({
    family: r.core.family,
    coreId: r.core.id,
    wireKind: wire.kind,
    strands: inHand,
    strandArea: copperArea / inHand,
    rmsCurrent: r.operatingPoint.rmsCurrent,
  });
  const resistance = resistanceLimit(r.copper.resistance20, copperArea);
  const lTest = inductanceTest({
    inductance: nominal,
    switchingFrequency: r.operatingPoint.frequency,
    turns: r.turns,
    ae: r.core.ae,
    ripplePeakFlux: r.flux.acPeak,
  });
  const bias = biasTest({
    nominal,
    atCheckCurrent: r.inductance.atPeak,
    checkCurrent: r.flux.checkCurrent,
    saturationMargin: r.flux.saturationMargin,
    tolerance: tol,
  });
  const full = r.winding.turnsPerLayer;
  const lastLayerTurns = r.turns - full * (r.winding.layers - 1);
  const isRing = r.core.family === 'RING' || r.core.family === 'POWDER_TOROID';
  const foil = wire.kind === 'foil';

  return {
    header: {
      designNumber: input.design.number,
      title: input.design.title,
      revision: input.revision.revision,
      orderNumber: input.order.number,
      quantity: input.order.quantity,
      releasedAt: input.order.releasedAt.toISOString(),
      author: input.author,
      approver: input.approver,
      engineVersion: input.revision.engineVersion,
    },
    parts: {
      coreSet: isRing ? `Ring core ${r.core.id}` : `Core set ${r.core.id} (pair)`,
      coreMaterial: r.material.name,
      gap: gapPart(r),
      bobbin: isRing
        ? 'No bobbin: wind directly on the coated ring (add an edge-protecting wrap if the coating is thin).'
        : `Bobbin for ${r.core.id}` + (core ? `, winding width ${mm(core.bobbinWidth, 1)}, build height ${mm(core.bobbinHeight, 1)}` : ''),
      wire: {
        description: wireDescription(wire, copperArea),
        kind: wire.kind,
        strandDiameter: wire.strandDiameter,
        strands: wire.strands,
        overallDiameter: wire.overallDiameter,
        grade: wire.grade ?? null,
        length: wireLength,
        mass: copperArea * wireLength * COPPER_DENSITY,
        conductorsInHand: inHand,
        totalLength: inHand * wireLength,
        leadLength: LEAD_LENGTH,
      },
      tapes: isRing
        ? ['Polyester tape 0.05 mm over the finished winding (one wrap)']
        : [
            `Polyester tape 0.05 mm, width ${core ? mm(core.bobbinWidth, 0) : 'of the bobbin winding width'}: one wrap between layers`,
            'Polyester tape 0.05 mm: two wraps over the finished winding',
            'Polyester tape around the assembled core set to hold the halves',
          ],
    },
    winding: {
      startPin: plan.startText,
      finishPin: plan.finishText,
      turns: r.turns,
      layers: r.winding.layers,
      turnsPerLayer: full,
      lastLayerTurns,
      direction: 'Clockwise viewed from the pin side (from the start lead for a ring)',
      traverse: foil
        ? 'One turn per layer: foil centred on the winding width with equal edge margins, wound tight and flat, edges aligned'
        : 'Progressive, close-wound, turns side by side; wires in hand laid flat and parallel, not twisted',
      interlayerTape: foil
        ? `Interlayer film ${mm(wire.overallDiameter - wire.strandDiameter, 3)} wound together with the foil, under every turn, wider than the foil`
        : isRing || r.winding.layers < 2
          ? 'None'
          : 'One wrap of polyester tape between layers',
      margins: input.insulation.required
        ? 'Margins as required by the insulation specification of the design owner'
        : 'None (no safety insulation required)',
      outerWrap: 'Two wraps of polyester tape',
      keepOut: gapped && !isRing ? r.winding.keepOut : null,
    },
    terminations: plan.lines,
    termination: {
      kind: plan.kind,
      pinCount: plan.pinCount,
      startPins: plan.startPins,
      finishPins: plan.finishPins,
      perPin: plan.perPin,
      strapArea: plan.strapArea,
    },
    assembly: !gapped
      ? ['Handle the ring without chipping the coating; no force on the finished winding']
      : spacer
        ? [
            `Check the spacer thickness with a micrometer before assembly: ${mm(r.gap.spacer, 3)}`,
            'Lay the spacer under every leg (centre and outer legs), the same thickness everywhere; no ground gap in either half',
            'Clamp or tape the core set evenly so the spacer stays flat; glue only at the outer legs if glued',
            'Ferrite is brittle: no dropping, no force on the gap',
          ]
        : [
            'Check the ground gap with a feeler gauge before assembly',
            'Insert the core halves, ground half as specified; keep gap faces clean (no tape or glue inside the gap)',
            'Clamp or tape the core set; glue only at the outer legs if glued',
            'Ferrite is brittle: no dropping, no force on the gap',
          ],
    impregnation: 'No varnish unless the design owner asks for it (varnish changes inductance slightly and must then be re-measured).',
    tests: {
      inductance: {
        nominal,
        min: nominal * (1 - tol),
        max: nominal * (1 + tol),
        testFrequency: lTest.frequency,
        testLevel: lTest.level,
        reactance: lTest.reactance,
        resolution: lTest.resolution,
        testFlux: lTest.flux,
      },
      resistanceMax20: resistance.max,
      resistance,
      biasInductance: bias,
      hipot: input.insulation.required
        ? {
            required: true,
            instruction:
              input.insulation.hipotInstruction ??
              'Winding to core: test voltage, time and leakage limit as set by the design owner from the applicable standard',
          }
        : { required: false, instruction: 'Not required (no safety insulation in this design)' },
    },
    marking: `${input.design.number} rev ${input.revision.revision}, date code (YYWW), pin-1 dot`,
    predicted: {
      inductanceNominal: nominal,
      resistance20: r.copper.resistance20,
      totalLoss: r.totalLoss,
      hotSpot: r.thermal.hotSpot,
      peakFlux: r.flux.peak,
      saturationAtHotSpot: r.flux.saturationAtHotSpot,
    },
    caution: SHEET_CAUTION,
    drawing: core ? windingDrawingInput(r, core, wire) : null,
  };
}
