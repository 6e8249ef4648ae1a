// Losses of one built part from light to full load at three input voltages: the "loss map" of the design page.
import { buckWaveform, waveformFlux, type ConductionMode } from './buck-waveform';
import { AC_TEMPERATURE_NODES } from './copper-loss';
import { igsePiecewiseLinearLoss } from './core-loss';
import { copperResistivity } from './copper';
import { biasLossFactor, coreDcField } from './dc-bias-loss';
import { dowellFactor, dowellSkinTerm } from './dowell';
import { litzProximitySum, litzWindingFactor } from './litz';
import { evaluateDesign, type EvaluateInput, type EvaluationResult } from './evaluate';
import { MAX_HARMONIC } from './harmonics';
import { transverseFieldLoss } from './gap-field-loss';
import { CandidateFigures, foilGapResistanceOf, gapLossScale, prepareCore, prepareSpec, prepareWire, strandsPerPosition } from './kernel';
import { designMagnetics } from './magnetic-design';
import { piecewiseLinearSpectrum } from './piecewise-harmonics';
import { biasedInductance } from './powder';
import { emptyWoundCoreLoss, solveTemperature, ThermalSolution } from './thermal';
import { layWinding } from './winding';

/** 10 % to 100 % of full load in steps of 10 %. */
export const LOAD_FRACTIONS: readonly number[] = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1];

export type InputCorner = 'min' | 'nominal' | 'max';

export interface LoadPoint {
  corner: InputCorner;
  vin: number;
  loadFraction: number;
  iout: number;
  mode: ConductionMode;
  peakCurrent: number;
  copperDc: number;
  copperAc: number;
  /** Winding loss from the gap's fringing field (gap-field-loss.ts) with this point's harmonics. */
  copperGap: number;
  core: number;
  total: number;
  /** The inductor's loss over the output power Vout·Iout. */
  share: number;
  rise: number;
  /** No steady temperature below the thermal model's limit at this point. */
  runaway: boolean;
}

export interface LossMap {
  /** The inductance the map runs with: the built part's nominal (a powder part's at each load's bias) (H). */
  inductance: number;
  /** Input voltages of the three corners; nominal is the midpoint when the spec gives none. */
  inputs: Record<InputCorner, number>;
  points: LoadPoint[];
}

/** Harmonics of a foil winding's gap-field loss the load map sums (see lossMap). */
const FOIL_GAP_HARMONICS = 40;

/**
 * The built part (turns, gap, wire as evaluateDesign makes them, at its nominal inductance) run at each load and input
 * voltage: the real current waveform (CCM, boundary or DCM, buckWaveform), the copper loss from its DC value and
 * every harmonic's Dowell factor, the core loss by the iGSE over each linear segment of the flux (a resting segment
 * adds none; relaxation after it is not modelled) times the DC-bias factor at that load's DC field, the gap's
 * fringing-field loss from the same harmonics at the design's keep-out, iterated with the temperature as
 * evaluateDesign does. `base` is evaluateDesign(input), passed in where the caller already has it.
 */
export function lossMap(
  input: EvaluateInput,
  fractions: readonly number[] = LOAD_FRACTIONS,
  base: EvaluationResult = evaluateDesign(input),
): LossMap {
  const { spec, core, material } = input;
  const ctx = prepareSpec(spec, input.limits, true);
  const wire = prepareWire(input.wire, ctx);
  const part = prepareCore(core).thermal;
  const layers = Number.isFinite(base.winding.layers) ? base.winding.layers : 1;
  const referenceResistivity = copperResistivity(ctx.acTemperature);
  const litzGeometry = litzWindingFactor(base.turns, core.bobbinWidth);
  const inductanceAt = (iout: number) => biasedInductance(base.turns, iout, base.inductanceFactor.withFringing, core.le, material.rollOff);
  const inputs: Record<InputCorner, number> = {
    min: spec.vinMin,
    nominal: spec.vinNom ?? (spec.vinMin + spec.vinMax) / 2,
    max: spec.vinMax,
  };
  // The gap-field loss: the layout's scale (per unit of Σ (I_n²/2)·P′_n) and each harmonic's P′_n at each AC node.
  const mag = designMagnetics(core, material, ctx, input.turns, input.gap, input.placement);
  const layout = new CandidateFigures();
  layWinding(mag.turns, input.wire, core, layout);
  const keepOut = input.keepOut ?? ctx.limits.keepOut;
  const gapScale = gapLossScale(core, material, mag, layout, input.wire, keepOut, true);
  const transverse: Float64Array[] = [];
  if (gapScale > 0) {
    const strands = strandsPerPosition(input.wire);
    for (let node = 0; node < AC_TEMPERATURE_NODES; node++) {
      const resistivity = copperResistivity(ctx.acGrid.temperatures[node]!);
      const perHarmonic = new Float64Array(MAX_HARMONIC);
      for (let n = 1; n <= MAX_HARMONIC; n++) {
        // Foil: its gap-field resistance per unit of its scale (foil-gap-loss.ts), the weight of I_n²/2, to the
        // FOIL_GAP_HARMONICS-th harmonic (a field solve each; the ripple's n⁻⁴ leaves the rest below 1e-4 of the sum).
        if (input.wire.kind === 'foil') {
          perHarmonic[n - 1] =
            n <= FOIL_GAP_HARMONICS
              ? foilGapResistanceOf(core, material, mag, input.wire, keepOut, n * spec.frequency, resistivity) / gapScale
              : 0;
        } else perHarmonic[n - 1] = strands * transverseFieldLoss(input.wire.strandDiameter, n * spec.frequency, resistivity);
      }
      transverse.push(perHarmonic);
    }
  }
  const loss = emptyWoundCoreLoss();
  const thermal = new ThermalSolution();
  const points: LoadPoint[] = [];
  for (const corner of ['min', 'nominal', 'max'] as const) {
    for (const loadFraction of fractions) {
      const iout = loadFraction * spec.ioutMax;
      const waveform = buckWaveform(spec, inputs[corner], iout, inductanceAt(iout));
      const spectrum = piecewiseLinearSpectrum(waveform.times, waveform.current, MAX_HARMONIC);
      // Litz strand by strand (litz.ts), as the design point does; other conductors by Dowell per harmonic.
      const litz =
        input.wire.kind === 'litz'
          ? litzProximitySum(input.wire.strands, input.wire.strandDiameter, referenceResistivity, spec.frequency, spectrum) * litzGeometry
          : 0;
      for (let node = 0; node < AC_TEMPERATURE_NODES; node++) {
        const scale = ctx.acGrid.scales[node]!;
        const delta = wire.firstHarmonicDelta * scale;
        let weight = litz * scale ** 4;
        for (let n = 1; n <= MAX_HARMONIC; n++) {
          const term = litz ? dowellSkinTerm(delta * Math.sqrt(n)) : dowellFactor(delta * Math.sqrt(n), layers);
          weight += term * spectrum.meanSquare[n - 1]!;
        }
        loss.rippleWeights[node] = weight;
        if (gapScale > 0) {
          let gap = 0;
          for (let n = 1; n <= MAX_HARMONIC; n++) gap += transverse[node]![n - 1]! * spectrum.meanSquare[n - 1]!;
          loss.gapLossWeights[node] = gap;
        }
      }
      loss.gapLossScale = gapScale;
      loss.resistance20 = base.copper.resistance20;
      loss.dcCurrentSquare = spectrum.average * spectrum.average;
      loss.acGrid = ctx.acGrid;
      // The DC flux of an air-gapped core at this load is L·I/(N·Ae) (a powder's field is N·I/le, coreDcField).
      const dcField = coreDcField(
        core.gapKind,
        (inductanceAt(iout) * iout) / (base.turns * core.ae),
        material.permeability,
        base.turns,
        iout,
        core.le,
      );
      loss.coreLossReference =
        igsePiecewiseLinearLoss(material, waveform.times, waveformFlux(waveform, base.turns, core.ae)) *
        core.ve *
        biasLossFactor(material.biasLoss, dcField);
      loss.temperatureCoefficients = material.tempCoefficients;
      solveTemperature(ctx.limits, loss, part, thermal);
      const total = thermal.totalLoss;
      points.push({
        corner,
        vin: inputs[corner],
        loadFraction,
        iout,
        mode: waveform.mode,
        peakCurrent: waveform.peak,
        copperDc: thermal.resistance * loss.dcCurrentSquare,
        copperAc: thermal.resistance * thermal.rippleWeight,
        copperGap: thermal.gapLoss,
        core: thermal.coreLoss,
        total,
        share: total / (spec.vout * iout),
        rise: thermal.rise.design,
        runaway: thermal.runaway,
      });
    }
  }
  return { inductance: inductanceAt(spec.ioutMax), inputs, points };
}
