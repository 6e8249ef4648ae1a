// The winding sheet: everything the shop needs to build and test one released revision.
// Built once at release from the revision's frozen result; lengths in m, inductance in H,
// resistance in Ω, frequencies in Hz, temperatures in °C (SI inside, formatted at the edges). Its schema, for the
// stored JSON and the order's answer: shared/schemas/winding-sheet.ts. Fields added after the first release are optional:
// sheets frozen before them read as they were.
import type { BiasTest, ResistanceLimit } from './test-limits';
import type { TerminationPlan } from './terminations';
import type { WindingDrawingInput } from './winding-drawing';

export interface SheetTestLimits {
  inductance: {
    nominal: number;
    min: number;
    max: number;
    /** Small-signal test: frequency (Hz) and level (V rms), no DC bias. */
    testFrequency: number;
    testLevel: number;
    /** 2πfL at the test frequency (Ω) and what the meter must resolve (Ω); the test level's peak flux (T). */
    reactance?: number;
    resolution?: number;
    testFlux?: number;
  };
  /** Largest DC resistance at 20 °C (Ω), at the pins: winding, leads and joints with the allowance. */
  resistanceMax20: number;
  /** How resistanceMax20 is made up, and whether to measure four-wire. */
  resistance?: ResistanceLimit;
  /** Inductance under DC bias, where saturation matters; null where not asked for. */
  biasInductance?: BiasTest | null;
  hipot: { required: boolean; instruction: string };
}

export interface WindingSheet {
  header: {
    designNumber: string;
    title: string;
    revision: number;
    orderNumber: string;
    quantity: number;
    releasedAt: string;
    author: string;
    approver: string;
    engineVersion: string;
  };
  parts: {
    coreSet: string;
    coreMaterial: string;
    gap: {
      kind: 'centre-leg ground' | 'spacer under all legs' | 'none (distributed gap)';
      /** Sum of the gaps in the magnetic path (m): the ground gap, or twice the spacer. */
      total: number;
      /** Centre-leg gap to grind (m); 0 for a spacer design. */
      groundDepth: number;
      /** Spacer thickness (m) of a spacer design; 0 otherwise. */
      spacer: number;
      /** Ground design: the spacer under all legs that gives the same inductance (m); 0 otherwise. */
      spacerAlternative: number;
      /** ΔL/L for 10 µm more ground gap or spacer. */
      sensitivity10um: number;
      note: string;
    };
    bobbin: string;
    wire: {
      description: string;
      kind: string;
      strandDiameter: number;
      strands: number;
      overallDiameter: number;
      grade: number | null;
      /** One conductor in hand: winding + 2 leads (m). */
      length: number;
      /** Copper of all conductors in hand (kg). */
      mass: number;
      /** Conductors in hand (1 for litz and foil) and their length together (m). */
      conductorsInHand?: number;
      totalLength?: number;
      /** Each lead (m). */
      leadLength?: number;
    };
    tapes: string[];
  };
  winding: {
    startPin: string;
    finishPin: string;
    turns: number;
    layers: number;
    turnsPerLayer: number;
    lastLayerTurns: number;
    direction: string;
    traverse: string;
    interlayerTape: string;
    margins: string;
    outerWrap: string;
    /**
     * Clearance from the centre leg (and its gap) to the first layer's copper the design was evaluated with (m): the
     * gap's fringing field drives eddy loss in copper close to it. Null where there is no air gap (ring, distributed
     * gap); absent on sheets released before it was given.
     */
    keepOut?: number | null;
  };
  terminations: string[];
  /** Where the ends go: pins (listed), a strap or flying leads; absent on sheets released before it. */
  termination?: Pick<TerminationPlan, 'kind' | 'pinCount' | 'startPins' | 'finishPins' | 'perPin' | 'strapArea'>;
  assembly: string[];
  impregnation: string;
  tests: SheetTestLimits;
  marking: string;
  predicted: {
    inductanceNominal: number;
    resistance20: number;
    totalLoss: number;
    hotSpot: number;
    peakFlux: number;
    saturationAtHotSpot: number;
  };
  caution: string;
  /** What the winding drawing is drawn from (winding-drawing.ts); null without the core's shape, absent on older sheets. */
  drawing?: WindingDrawingInput | null;
}

export const SHEET_CAUTION =
  'Engineering estimate: this part was sized by calculation and must be verified on a prototype ' +
  '(inductance against DC current, temperature rise at worst-case line and load, current-limit test) before ' +
  'quantity builds. Inductors get hot and can saturate into a short circuit. Mains-connected or high-voltage ' +
  'converters need creepage, clearance, insulation class and hipot levels set by the applicable standards ' +
  '(e.g. IEC 62368-1) and local codes, and a qualified engineer’s review; ferrite cores are semiconductive — treat ' +
  'the core as live unless insulated.';
