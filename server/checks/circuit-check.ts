// The circuit check of a saved design: its power stage simulated by ngspice with the design's inductor at the corners
// that matter (Vin max, Vin min, the current limit) and compared with the engine's own prediction of the inductor
// current. The plan and the comparison are pure; ngspice runs through the buck bench (server/solvers/buck-bench.ts).
import { biasedInductance, dutyCycle, operatingPoint, rollOffIntegral, type EvaluationResult } from '@shared/engine/index';
import type { ConverterSpec } from '@shared/engine/inputs';
import type { RollOffFit } from '@shared/engine/types';
import type { CircuitCheckResult, CircuitCorner, ExportedModelRun } from '@shared/schemas/checks';
import { ENGINE_VERSION } from '@shared/engine/index';
import { buildSpiceSubcircuit, spiceSubcircuitName } from '../exports/spice.ts';
import { simulateBuck, simulateBuckSteady, type BuckBench, type FluxTable, type SimulatedCurrent } from '../solvers/buck-bench.ts';
import { decimateWaveform, predictedTriangle } from './waveforms.ts';

export interface CircuitCheckInput {
  spec: ConverterSpec;
  evaluation: EvaluationResult;
  /** The design's material roll-off (powder), if it has one. */
  rollOff?: RollOffFit;
}

interface PlannedCorner {
  id: CircuitCorner['id'];
  label: string;
  bench: BuckBench;
  load: number;
  predictedInductance: number;
  predicted: CircuitCorner['predicted'];
}

export interface CircuitCheckPlan {
  model: CircuitCheckResult['inductorModel'];
  nominalInductance: number;
  windingResistance: number;
  notes: string[];
  corners: PlannedCorner[];
}

/** Points of the flux-linkage table over ± its range: fine enough for tens of points across one ripple. */
const TABLE_POINTS = 401;
/** The table reaches this multiple of the highest corner's predicted peak, so the solver never leaves it. */
const TABLE_REACH = 2.5;

/**
 * Λ(i) = AL·N·le·∫₀^(N·i/le) μ%(h) dh: the flux linkage N·Ae·B of a distributed-gap core whose B is the engine's
 * biasedFlux (μ0·μi·∫μ% dh, with AL = μ0·μi·Ae/le), so dΛ/di = AL·N²·μ%(N·i/le) is the engine's incremental L.
 */
export function powderFluxTable(
  turns: number,
  inductanceFactor: number,
  pathLength: number,
  rollOff: RollOffFit,
  reach: number,
): FluxTable {
  const current: number[] = [];
  const fluxLinkage: number[] = [];
  for (let k = 0; k < TABLE_POINTS; k++) {
    const i = reach * ((2 * k) / (TABLE_POINTS - 1) - 1);
    current.push(i);
    fluxLinkage.push(Math.sign(i) * inductanceFactor * turns * pathLength * rollOffIntegral(rollOff, (turns * i) / pathLength));
  }
  return { current, fluxLinkage };
}

/** The engine's ripple (A peak-to-peak) at one input voltage and load with inductance L, by its own operating point. */
function engineRipple(spec: ConverterSpec, vin: number, load: number, inductance: number): number {
  const at: ConverterSpec = {
    ...spec,
    vinMin: vin,
    vinMax: vin,
    ioutMax: load,
    inductance,
    rippleRatio: undefined,
    rippleCurrent: undefined,
  };
  return operatingPoint(at, 0).rippleAtVinMax;
}

/**
 * What to simulate. An ideal rectifier becomes a synchronous one with 1 µΩ switches, and the design's winding
 * resistance at the hot spot goes into the loop when the spec gives none: the bench holds the output at Vout, so
 * without loop resistance the current would never settle (and the engine's duty then includes that drop too).
 */
export function planCircuitCheck({ spec, evaluation, rollOff }: CircuitCheckInput): CircuitCheckPlan {
  const notes: string[] = [];
  const windingResistance = spec.inductorResistance ?? evaluation.copper.resistanceHot;
  if (spec.inductorResistance === undefined) notes.push('Winding resistance: the design’s DC resistance at the predicted hot spot.');
  const benchSpec: ConverterSpec =
    spec.rectifier === 'ideal'
      ? { ...spec, rectifier: 'synchronous', highSideResistance: 0, lowSideResistance: 0, inductorResistance: windingResistance }
      : { ...spec, inductorResistance: windingResistance };
  if (spec.rectifier === 'ideal') notes.push('The ideal rectifier is simulated as switches of 1 µΩ.');

  const nominal = evaluation.inductance.nominal;
  const powder = evaluation.core.gapKind === 'distributed' && rollOff !== undefined;
  const { turns } = evaluation;
  const al = evaluation.inductanceFactor.withFringing;
  const le = evaluation.core.le;
  const inductanceAt = (load: number) => (powder ? biasedInductance(turns, load, al, le, rollOff) : nominal);
  notes.push(
    powder
      ? 'Inductor: flux linkage from the material’s DC-bias roll-off, so L falls with current over the ripple; predicted with the engine’s incremental L at the load current.'
      : 'Inductor: constant, the design’s nominal inductance at zero current with the gap’s fringing (an air-gapped core keeps it up to saturation).',
  );

  const wanted: { id: CircuitCorner['id']; label: string; vin: number; load: number }[] = [
    { id: 'vin-max' as const, label: `Vin max ${spec.vinMax} V, ${spec.ioutMax} A`, vin: spec.vinMax, load: spec.ioutMax },
    { id: 'vin-min' as const, label: `Vin min ${spec.vinMin} V, ${spec.ioutMax} A`, vin: spec.vinMin, load: spec.ioutMax },
  ];
  if (spec.currentLimit !== undefined && spec.currentLimit > 0) {
    wanted.push({
      id: 'current-limit',
      label: `Current limit ${spec.currentLimit} A at Vin max ${spec.vinMax} V`,
      vin: spec.vinMax,
      load: spec.currentLimit,
    });
  } else notes.push('No current limit in the spec: that corner is skipped.');

  const predictions = wanted.map((c) => {
    const ripple = engineRipple(benchSpec, c.vin, c.load, inductanceAt(c.load));
    return { ripple, peak: c.load + ripple / 2, average: c.load, valley: c.load - ripple / 2 };
  });
  const highestPeak = Math.max(...predictions.map((p) => p.peak));
  const fluxTable = powder ? powderFluxTable(turns, al, le, rollOff, TABLE_REACH * highestPeak) : undefined;
  const corners = wanted.map((c, k) => ({
    id: c.id,
    label: c.label,
    load: c.load,
    predictedInductance: inductanceAt(c.load),
    predicted: predictions[k]!,
    bench: { spec: benchSpec, vin: c.vin, duty: dutyCycle(benchSpec, c.vin, c.load), inductance: nominal, fluxTable },
  }));
  return { model: powder ? 'roll-off' : 'constant', nominalInductance: nominal, windingResistance, notes, corners };
}

const percent = (simulated: number, predicted: number) => (100 * (simulated - predicted)) / predicted;

/** One corner's comparison: the simulated last period against the engine's triangle at its ripple. */
export function compareCorner(corner: PlannedCorner, simulated: SimulatedCurrent): CircuitCorner {
  const { spec, vin, duty } = corner.bench;
  const { predicted } = corner;
  const period = 1 / spec.frequency;
  return {
    id: corner.id,
    label: corner.label,
    vin,
    load: corner.load,
    duty,
    predictedInductance: corner.predictedInductance,
    simulated: { ripple: simulated.ripple, peak: simulated.peak, average: simulated.average, valley: simulated.valley },
    predicted,
    differencePercent: {
      ripple: percent(simulated.ripple, predicted.ripple),
      peak: percent(simulated.peak, predicted.peak),
      average: percent(simulated.average, predicted.average),
    },
    drift: simulated.drift,
    waveform: {
      simulated: decimateWaveform(simulated.lastPeriod.time, simulated.lastPeriod.current, 200),
      predicted: predictedTriangle(predicted.valley, predicted.peak, duty, period),
    },
  };
}

export interface CircuitCheckRun {
  /** Called after each corner with the share done (0…1); may throw to stop the run (a cancelled check). */
  onProgress?: (progress: number) => Promise<void>;
  /** Simulates one corner's bench to its periodic steady state, from a guess of the current at switch-on (A). */
  simulate?: (bench: BuckBench, guess: number) => Promise<SimulatedCurrent>;
  /** Simulates a bench for its given periods from its given start (the exported model's run). */
  simulateFrom?: (bench: BuckBench) => Promise<SimulatedCurrent>;
}

/** Periods the exported model runs from the steady state the Vin-max corner found; the last one is read. */
const EXPORTED_MODEL_PERIODS = 6;

/**
 * The exported subcircuit (buildSpiceSubcircuit, as the export writes it) between the bench's switch node and output at
 * the Vin-max corner, started at the valley of the average current that corner settled to: the subcircuit's
 * resistances do not change the DC loop resistance (its AC branch and core resistor are shorted by inductors at DC), so
 * that average is its steady state too, and a few periods settle its small AC branch.
 */
export async function runExportedModel(
  input: CircuitCheckInput,
  corner: PlannedCorner,
  settledAverage: number,
  simulateFrom: (bench: BuckBench) => Promise<SimulatedCurrent>,
): Promise<ExportedModelRun> {
  const { evaluation } = input;
  const inductance = evaluation.inductance.atLoad;
  // The subcircuit carries its own winding resistance (RDC at the hot spot): the duty is set for it, so a spec that
  // names another inductor resistance does not move the subcircuit's steady state away from the load current.
  const spec: ConverterSpec = { ...corner.bench.spec, inductorResistance: evaluation.copper.resistanceHot };
  const { vin } = corner.bench;
  const ripple = engineRipple(spec, vin, corner.load, inductance);
  const startCurrent = settledAverage - ripple / 2;
  const header = { designNumber: 'DUT', title: 'design under test', revision: 0, engineVersion: ENGINE_VERSION };
  const text = buildSpiceSubcircuit(header, evaluation);
  const name = spiceSubcircuitName(header.designNumber, header.revision);
  const bench: BuckBench = {
    ...corner.bench,
    spec,
    duty: dutyCycle(spec, vin, corner.load),
    subcircuit: { name, text },
    initialCurrent: startCurrent,
    periods: EXPORTED_MODEL_PERIODS,
    reltol: 1e-6,
  };
  const simulated = await simulateFrom(bench);
  const predicted = { ripple, peak: corner.load + ripple / 2, average: corner.load, loss: evaluation.totalLoss };
  const dissipation = simulated.dissipation ?? Number.NaN;
  return {
    vin,
    load: corner.load,
    inductance,
    simulated: { ripple: simulated.ripple, peak: simulated.peak, average: simulated.average, dissipation },
    predicted,
    differencePercent: {
      ripple: percent(simulated.ripple, predicted.ripple),
      peak: percent(simulated.peak, predicted.peak),
      dissipation: percent(dissipation, predicted.loss),
    },
    drift: simulated.drift,
  };
}

/** Simulates every corner in turn and compares each with the engine's prediction. */
export async function runCircuitCheck(input: CircuitCheckInput, run: CircuitCheckRun = {}): Promise<CircuitCheckResult> {
  const plan = planCircuitCheck(input);
  const simulate = run.simulate ?? ((bench: BuckBench, guess: number) => simulateBuckSteady(bench, guess, 30_000));
  const corners: CircuitCorner[] = [];
  let exportedModel: ExportedModelRun | undefined;
  const steps = plan.corners.length + 1;
  for (const corner of plan.corners) {
    // The engine's valley is only where the search starts: the steady state is the simulator's own.
    const simulated = await simulate(corner.bench, corner.predicted.valley);
    corners.push(compareCorner(corner, simulated));
    await run.onProgress?.(corners.length / steps);
    if (corner.id === 'vin-max') {
      exportedModel = await runExportedModel(input, corner, simulated.average, run.simulateFrom ?? ((b) => simulateBuck(b, 30_000)));
    }
  }
  await run.onProgress?.(1);
  return {
    kind: 'circuit',
    inductorModel: plan.model,
    nominalInductance: plan.nominalInductance,
    windingResistance: plan.windingResistance,
    notes: plan.notes,
    corners,
    ...(exportedModel ? { exportedModel } : {}),
  };
}
