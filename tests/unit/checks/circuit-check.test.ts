import { describe, expect, it } from 'vitest';
import { biasedInductance, evaluateDesign, type EvaluationResult } from '@shared/engine/index';
import type { ConverterSpec } from '@shared/engine/inputs';
import { planCircuitCheck, powderFluxTable, runCircuitCheck } from '../../../server/checks/circuit-check.ts';
import { decimateWaveform } from '../../../server/checks/waveforms.ts';
import { spiceValues } from '../../../server/exports/spice.ts';
import { simulateBuckSteady } from '../../../server/solvers/buck-bench.ts';
import { etd34Like, ferriteA, powderP, powderRing, roundWire, sectionOneSpec } from '../engine/fixtures.ts';

// The circuit check: the design's inductor in ngspice's buck power stage against the engine's predicted inductor
// current. Both specs are invented (the engine fixtures' 24–36 V → 12 V, 10 A, 100 kHz buck with switches added).

const ferriteSpec: ConverterSpec = {
  ...sectionOneSpec,
  rectifier: 'synchronous',
  highSideResistance: 0.01,
  lowSideResistance: 0.008,
  inductorResistance: 0.02,
  currentLimit: 13,
};
const powderSpec: ConverterSpec = { ...ferriteSpec, currentLimit: undefined, rectifier: 'ideal', inductorResistance: undefined };

const evaluate = (spec: ConverterSpec, powder: boolean): EvaluationResult =>
  evaluateDesign({
    spec,
    limits: { inductanceTolerance: 0 },
    core: powder ? powderRing : etd34Like,
    material: powder ? powderP : ferriteA,
    turns: 'auto',
    gap: 'auto',
    wire: roundWire(0.8e-3, 3),
  });

describe('circuit check of an air-gapped ferrite design (constant nominal L)', () => {
  const evaluation = evaluate(ferriteSpec, false);

  it('simulates Vin max, Vin min and the current limit; ripple and peak within 2 % of the engine (target set by the issue)', async () => {
    const progress: number[] = [];
    const result = await runCircuitCheck({ spec: ferriteSpec, evaluation }, { onProgress: async (p) => void progress.push(p) });
    expect(result.inductorModel).toBe('constant');
    expect(result.corners.map((c) => c.id)).toEqual(['vin-max', 'vin-min', 'current-limit']);
    expect(progress).toEqual([1 / 4, 2 / 4, 3 / 4, 1]);
    for (const corner of result.corners) {
      expect(Math.abs(corner.differencePercent.ripple)).toBeLessThan(2);
      expect(Math.abs(corner.differencePercent.peak)).toBeLessThan(2);
      expect(Math.abs(corner.differencePercent.average)).toBeLessThan(0.5);
      expect(corner.waveform.simulated.length).toBeLessThanOrEqual(200);
      expect(corner.waveform.simulated.at(-1)![0]).toBeCloseTo(1 / ferriteSpec.frequency, 9);
    }
    expect(result.corners[2]!.load).toBe(13);

    // The exported subcircuit in the same bench (the export's own text): its current against the engine's at the
    // subcircuit's L, settled (drift below 0.1 % of the load), and the power its resistors dissipate against the
    // engine's total loss. The subcircuit is a single-frequency equivalent (its AC branch is exact at fs only and its
    // core resistor takes Vrms² of the square wave), so the dissipation is held to 5 % (common practice for a
    // behavioural model at its operating point, no source); measured here: 1.480 W against 1.501 W (−1.4 %). Its AC
    // branch RAC ∥ LAC (dR at fs) also carries a reactance dR at fs in series with L1 — circuit algebra: a share
    // dR/(ωL) more impedance to the ripple, 3.4 % here with the gap field's loss in dR — so the ripple is held to
    // 2 % plus that share (measured −2.5 %).
    const exported = result.exportedModel!;
    expect(exported.vin).toBe(ferriteSpec.vinMax);
    const v = spiceValues(evaluation);
    const branchShare = v.acExtraResistance / (2 * Math.PI * ferriteSpec.frequency * v.inductance);
    expect(Math.abs(exported.differencePercent.ripple)).toBeLessThan(2 + 100 * branchShare);
    expect(Math.abs(exported.differencePercent.peak)).toBeLessThan(2);
    expect(Math.abs(exported.drift)).toBeLessThan(1e-3 * ferriteSpec.ioutMax);
    expect(Math.abs(exported.differencePercent.dissipation)).toBeLessThan(5);
  }, 180_000);
});

describe('circuit check of a powder design (L follows the roll-off)', () => {
  const evaluation = evaluate(powderSpec, true);
  const input = { spec: powderSpec, evaluation, rollOff: powderP.rollOff };

  it('builds a flux table whose slope is the engine’s incremental L (dΛ/di = AL·N²·μ%, derived algebraically)', () => {
    const { turns } = evaluation;
    const al = evaluation.inductanceFactor.withFringing;
    const table = powderFluxTable(turns, al, powderRing.le, powderP.rollOff!, 30);
    const k = 300; // i = 30·(600/400 − 1) = 15 A
    const slope = (table.fluxLinkage[k + 1]! - table.fluxLinkage[k - 1]!) / (table.current[k + 1]! - table.current[k - 1]!);
    expect(slope / biasedInductance(turns, table.current[k]!, al, powderRing.le, powderP.rollOff) - 1).toBeLessThan(1e-3);
    expect(table.fluxLinkage[0]).toBeCloseTo(-table.fluxLinkage.at(-1)!, 15);
  });

  it('peaks above the constant-L peak and matches the engine’s prediction at bias', async () => {
    const result = await runCircuitCheck(input);
    expect(result.inductorModel).toBe('roll-off');
    expect(result.corners.map((c) => c.id)).toEqual(['vin-max', 'vin-min']);
    const plan = planCircuitCheck(input);
    // The same bench with a constant inductor at the zero-current L: the roll-off must show as a higher peak.
    const constant = await simulateBuckSteady({ ...plan.corners[0]!.bench, fluxTable: undefined }, plan.corners[0]!.predicted.valley);
    const { turns } = evaluation;
    const al = evaluation.inductanceFactor.withFringing;
    for (const corner of result.corners) {
      expect(corner.simulated.peak).toBeGreaterThan(constant.peak);
      // Tolerance: the engine draws a triangle with the incremental L at the load current; the real L changes over
      // the ripple (derived algebraically from L(i)·di = v·dt on each leg, with L(i) ≈ L·(1 + k·(i − I)) + …):
      // Λ(I + δ) − Λ(I − δ) = 2δ·L(I) + (δ³/3)·L''(I) + …, so the ripple differs by about (δ²/6)·L''/L; and the time
      // spent at each current goes with L(i), so the period average lies k·δ²/3 from the midpoint of valley and peak:
      // the simulated peak sits that much above the engine's (average + δ). Both are evaluated from the roll-off
      // itself; 0.5 % is added for the bench (its averages land within 0.01 % of the load, README).
      const delta = corner.predicted.ripple / 2;
      const l = (i: number) => biasedInductance(turns, i, al, powderRing.le, powderP.rollOff);
      const lAt = l(corner.load);
      const curvature = Math.abs(l(corner.load + delta) - 2 * lAt + l(corner.load - delta)) / (6 * lAt);
      const shift = ((Math.abs(l(corner.load + delta) - l(corner.load - delta)) / (2 * lAt)) * delta) / 3;
      expect(curvature).toBeLessThan(0.005);
      expect(Math.abs(corner.differencePercent.ripple)).toBeLessThan(100 * curvature + 0.5);
      expect(Math.abs(corner.differencePercent.peak)).toBeLessThan(100 * (curvature + shift / corner.predicted.peak) + 0.5);
      // The asymmetry is there, the predicted size and way (measured: 21.5 mA against 21.5 mA at Vin max, 11.4 mA
      // against 12.0 mA at Vin min): the simulated peak is above the engine's.
      expect(corner.simulated.peak - corner.predicted.peak).toBeGreaterThan(0.8 * shift);
      expect(corner.simulated.peak - corner.predicted.peak).toBeLessThan(1.2 * shift + 1e-4 * corner.predicted.peak);
      expect(Math.abs(corner.differencePercent.average)).toBeLessThan(0.5);
    }
    // The roll-off is real here: the engine's L at the load is well below the zero-current L.
    expect(result.corners[0]!.predictedInductance).toBeLessThan(0.9 * result.nominalInductance);
  }, 180_000);
});

describe('waveform decimation', () => {
  it('keeps at most the limit and the highest and lowest sample', () => {
    const time = Array.from({ length: 1001 }, (_, k) => k);
    const current = time.map((t) => Math.sin(t / 37));
    const points = decimateWaveform(time, current, 200);
    expect(points.length).toBeLessThanOrEqual(200);
    expect(Math.max(...points.map((p) => p[1]))).toBe(Math.max(...current));
    expect(Math.min(...points.map((p) => p[1]))).toBe(Math.min(...current));
  });
});
