import { describe, expect, it } from 'vitest';
import { buckWaveform, waveformFlux } from '@shared/engine/buck-waveform';
import { igsePiecewiseLinearLoss, igseTriangleLoss } from '@shared/engine/core-loss';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { rippleHarmonic } from '@shared/engine/harmonics';
import type { ConverterSpec } from '@shared/engine/inputs';
import { lossMap } from '@shared/engine/load-map';
import { piecewiseLinearSpectrum } from '@shared/engine/piecewise-harmonics';
import { ferriteA, powderP, powderRing, roundWire, sectionOneSpec, workedDesign } from './fixtures';

describe('piecewiseLinearSpectrum', () => {
  it('gives the triangle wave its Fourier series I_n = ΔI·|sin(nπD)|/(n²π²D(1−D)) (standard Fourier series, from memory)', () => {
    const duty = 0.3;
    const spectrum = piecewiseLinearSpectrum([0, duty * 1e-5, 1e-5], [4, 6, 4], 40);
    for (const n of [1, 2, 3, 7, 10, 33]) {
      const amplitude = Math.sqrt(2 * spectrum.meanSquare[n - 1]!);
      expect(amplitude).toBeCloseTo(rippleHarmonic(2, duty, n), 12);
    }
    expect(spectrum.average).toBeCloseTo(5, 12);
  });

  it("adds up to the waveform's own RMS (Parseval's theorem) for a DCM pulse", () => {
    // 0 → 3 A over 20 % of the period, back to 0 over 35 %, resting for the remaining 45 %
    const spectrum = piecewiseLinearSpectrum([0, 2e-6, 5.5e-6, 1e-5], [0, 3, 0, 0], 2000);
    const sum = spectrum.meanSquare.reduce((a, b) => a + b, 0) + spectrum.average ** 2;
    // RMS² of a triangle of height 3 over 55 % of the period: 9·0.55/3
    expect(spectrum.rms ** 2).toBeCloseTo((9 * 0.55) / 3, 12);
    expect(sum / spectrum.rms ** 2).toBeCloseTo(1, 6);
    expect(spectrum.average).toBeCloseTo(1.5 * 0.55, 12);
  });

  it('refuses a waveform of fewer than three points', () => {
    expect(() => piecewiseLinearSpectrum([0, 1], [0, 0], 5)).toThrow(RangeError);
  });
});

const idealSpec: ConverterSpec = { vinMin: 12, vinMax: 24, vout: 5, ioutMax: 4, frequency: 100e3, inductance: 20e-6, rectifier: 'ideal' };

describe('buckWaveform', () => {
  it('in CCM has D = Vout/Vin and ΔI = (Vin − Vout)·D/(L·fs) with an ideal rectifier', () => {
    const w = buckWaveform(idealSpec, 24, 4, 20e-6);
    expect(w.mode).toBe('ccm');
    expect(w.rise).toBeCloseTo(5 / 24, 12);
    expect(w.peak - w.valley).toBeCloseTo((19 * (5 / 24)) / (20e-6 * 100e3), 12);
    expect(w.boundaryCurrent).toBeCloseTo((w.peak - w.valley) / 2, 12);
  });

  it('in DCM meets the DCM conversion ratio M = 2/(1 + √(1 + 4K/D²)), K = 2L·fs/R (Erickson and Maksimović, Fundamentals of Power Electronics, 2nd ed., ch. 5)', () => {
    const iout = 0.3;
    const w = buckWaveform(idealSpec, 24, iout, 20e-6);
    expect(w.mode).toBe('dcm');
    const k = (2 * 20e-6 * 100e3) / (5 / iout);
    const ratio = 2 / (1 + Math.sqrt(1 + (4 * k) / w.rise ** 2));
    expect(ratio).toBeCloseTo(5 / 24, 9);
    // the average of the triangle is the load current, and the current is back at zero before the period ends
    expect((w.peak * (w.rise + w.fall)) / 2).toBeCloseTo(iout, 12);
    expect(w.rise + w.fall).toBeLessThan(1);
  });

  it('stays continuous with a synchronous rectifier in forced PWM: the current reverses instead', () => {
    const spec: ConverterSpec = { ...idealSpec, rectifier: 'synchronous', highSideResistance: 0, lowSideResistance: 0 };
    const w = buckWaveform(spec, 24, 0.3, 20e-6);
    expect(w.mode).toBe('ccm');
    expect(w.valley).toBeLessThan(0);
  });

  it('names the boundary when the load is within 1 % of it', () => {
    const ripple = (19 * (5 / 24)) / (20e-6 * 100e3);
    expect(buckWaveform(idealSpec, 24, ripple / 2, 20e-6).mode).toBe('boundary');
  });

  it('gives the flux a rest in DCM, so the iGSE over it is below that of a CCM triangle of the same swing and slopes', () => {
    const w = buckWaveform(idealSpec, 24, 0.3, 20e-6);
    const flux = waveformFlux(w, 10, 100e-6);
    const loss = igsePiecewiseLinearLoss(ferriteA, w.times, flux);
    // the same rise and fall, with no rest: a shorter period at the same slopes; per second of operation the
    // resting DCM waveform loses (D1 + D2) of what the back-to-back triangle loses (the iGSE integrand is zero at rest)
    const busyPeriod = (w.rise + w.fall) / idealSpec.frequency;
    const triangle = igseTriangleLoss(ferriteA, 1 / busyPeriod, flux[1]!, w.rise / (w.rise + w.fall));
    expect(loss / triangle).toBeCloseTo(w.rise + w.fall, 9);
  });
});

const part: EvaluateInput = workedDesign;

describe('lossMap', () => {
  const map = lossMap(part);
  const at = (corner: 'min' | 'nominal' | 'max', fraction: number) =>
    map.points.find((p) => p.corner === corner && Math.abs(p.loadFraction - fraction) < 1e-9)!;

  it('covers 10 % to 100 % load at Vin min, nominal and max', () => {
    expect(map.points).toHaveLength(30);
    expect(map.inputs.nominal).toBeCloseTo((sectionOneSpec.vinMin + sectionOneSpec.vinMax) / 2, 12);
  });

  it('matches evaluateDesign at full load and Vin max when built to the required inductance (tolerance 0)', () => {
    const result = evaluateDesign(part);
    const full = at('max', 1);
    expect(full.mode).toBe('ccm');
    expect(full.core / result.coreLoss.loss).toBeCloseTo(1, 3);
    expect(full.copperDc / result.copper.dcLoss).toBeCloseTo(1, 3);
    expect(full.copperAc / result.copper.acLoss).toBeCloseTo(1, 2);
    // The gap-field loss: every harmonic of the exact waveform against the triangle's harmonics to the sum's tolerance.
    expect(result.copper.gapLoss!).toBeGreaterThan(0);
    expect(full.copperGap / result.copper.gapLoss!).toBeCloseTo(1, 3);
    expect(full.share).toBeCloseTo(full.total / (sectionOneSpec.vout * sectionOneSpec.ioutMax), 12);
  });

  it('a foil winding beside the gap: its gap-field loss (foil-gap-loss.ts) matches evaluateDesign at full load', () => {
    const foil: EvaluateInput = {
      ...part,
      wire: { id: 'foil 0.15', kind: 'foil', strandDiameter: 0.15e-3, overallDiameter: 0.2e-3, strands: 1, conductorsPerTurn: 1 },
    };
    const result = evaluateDesign(foil);
    const full = lossMap(foil).points.find((p) => p.corner === 'max' && Math.abs(p.loadFraction - 1) < 1e-9)!;
    expect(result.copper.gapLoss!).toBeGreaterThan(0);
    // The design sums harmonics to a 1e-4 bound, the map to the 40th: the same loss within that.
    expect(full.copperGap / result.copper.gapLoss!).toBeCloseTo(1, 2);
  });

  it('sums its lines and loses less at lighter load', () => {
    for (const p of map.points) expect(p.total).toBeCloseTo(p.copperDc + p.copperAc + p.copperGap + p.core, 9);
    expect(at('max', 0.1).total).toBeLessThan(at('max', 1).total);
  });

  it('keeps the core loss of forced-PWM CCM at every load, so the share of a small output grows (synchronous rectifier)', () => {
    const spec: ConverterSpec = { ...sectionOneSpec, rectifier: 'synchronous', highSideResistance: 0, lowSideResistance: 0 };
    const sync = lossMap({ ...part, spec });
    const light = sync.points.find((p) => p.corner === 'max' && p.loadFraction === 0.1)!;
    const full = sync.points.find((p) => p.corner === 'max' && p.loadFraction === 1)!;
    expect(light.mode).toBe('ccm');
    // the same flux swing at every load; only the temperature factor moves it
    expect(light.core / full.core).toBeGreaterThan(0.8);
    expect(light.share).toBeGreaterThan(full.share);
  });

  it('enters DCM at light load with a diode rectifier and keeps CCM where the load is above the boundary', () => {
    const light = at('max', 0.1);
    const boundary = buckWaveform(sectionOneSpec, sectionOneSpec.vinMax, light.iout, map.inductance).boundaryCurrent;
    expect(light.mode).toBe(light.iout < boundary ? 'dcm' : 'ccm');
  });

  it('runs a powder part at the inductance of each load (roll-off)', () => {
    const powder = lossMap({ ...part, core: powderRing, material: powderP, wire: roundWire(0.8e-3, 2) });
    expect(powder.points.every((p) => Number.isFinite(p.total) && p.total > 0)).toBe(true);
  });
});
