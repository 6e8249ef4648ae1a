import { describe, expect, it } from 'vitest';
import type { CoreShape, WireOption } from '@shared/engine/types';
import {
  conductorCopperArea,
  fitsBuildHeight,
  layWinding,
  ringMeanTurnLength,
  windowFill,
  type WindingGeometry,
} from '@shared/engine/winding';
import { chooseWire, roundWireInHand } from '@shared/engine/wire-choice';
import { copperSkinDepth } from '@shared/engine/skin-depth';
import { etd34Like, powderRing, roundWire, wireSet } from './fixtures';

function layout(turns: number, wire: WireOption, core: CoreShape): WindingGeometry {
  const out = { turnsPerLayer: 0, layers: 0, buildHeight: 0, meanTurnLength: 0 };
  layWinding(turns, wire, core, out);
  return out;
}

describe('winding layout', () => {
  it('lays floor(bobbinWidth/(conductors·d_o)) turns per layer on a bobbin (common practice, no source)', () => {
    const wire = { ...roundWire(0.8e-3, 3), overallDiameter: 0.86e-3 };
    const bobbin = layout(20, wire, etd34Like);
    // 21 mm / (3·0.86 mm) = 8.14 → 8 turns per layer, 20 turns → 3 layers, build 2.58 mm
    expect(bobbin.turnsPerLayer).toBe(8);
    expect(bobbin.layers).toBe(3);
    expect(bobbin.buildHeight * 1e3).toBeCloseTo(2.58, 9);
    expect(bobbin.meanTurnLength).toBe(etd34Like.mlt);
    expect(fitsBuildHeight(bobbin.buildHeight, etd34Like)).toBe(true);
    // copper fill Ku = N·strands·π·d²/4 / Wa (definition of window utilisation, computed)
    expect(windowFill(20, conductorCopperArea(wire), etd34Like.windowArea)).toBeCloseTo((20 * 3 * Math.PI * 0.8e-3 ** 2) / 4 / 175e-6, 12);
  });

  it('puts floor(π·(ID − d_o)/d_o) turns on the first layer of a ring (common practice, no source)', () => {
    const wire = { ...roundWire(0.95e-3), overallDiameter: 1e-3 };
    // π·(14.7 − 1)/1 = 43.04 → 43
    const ring = layout(60, wire, powderRing);
    expect(ring.turnsPerLayer).toBe(43);
    // second layer: π·(14.7 − 3)/1 = 36.8 → 36, so 60 turns take 2 layers
    expect(ring.layers).toBe(2);
    expect(ring.meanTurnLength).toBeCloseTo(ringMeanTurnLength(powderRing.ring!, 2e-3), 12);
  });

  it('takes the full ring window as the build for the mean turn when the wire does not fit at all', () => {
    // The search has always done this; the stand-alone layout used to fall back to the catalogue MLT instead.
    const thick = { ...roundWire(12e-3), overallDiameter: 12e-3 };
    const ring = layout(10, thick, powderRing);
    expect(ring.layers).toBe(Number.POSITIVE_INFINITY);
    expect(ring.meanTurnLength).toBeCloseTo(ringMeanTurnLength(powderRing.ring!, powderRing.bobbinHeight), 12);
    expect(fitsBuildHeight(ring.buildHeight, powderRing)).toBe(false);
  });

  it('reports a winding that does not fit the bobbin height', () => {
    const tall = layout(200, roundWire(1.0e-3), etd34Like);
    expect(tall.buildHeight).toBeGreaterThan(etd34Like.bobbinHeight);
    expect(fitsBuildHeight(tall.buildHeight, etd34Like)).toBe(false);
    expect(fitsBuildHeight(layout(20, roundWire(0.5e-3), etd34Like).buildHeight, etd34Like)).toBe(true);
  });
});

describe('wire choice', () => {
  const delta = copperSkinDepth(100e3, 90);

  it('picks the largest strand ≤ 2δ and enough strands for J (common practice, no source)', () => {
    // Irms 3 A at 4 A/mm² needs 0.75 mm²; 2δ ≈ 0.47 mm → 0.45 mm strands (0.159 mm²) → 5 in hand
    const choice = chooseWire(3, 4e6, delta, wireSet, 8);
    expect(choice.strandDiameter).toBeCloseTo(0.45e-3, 12);
    expect(choice.strands).toBe(5);
    expect(choice.useLitz).toBe(false);
    expect(choice.options[0]!.strands).toBe(5);
    expect((choice.options[0]!.strands * Math.PI * 0.45e-3 ** 2) / 4).toBeGreaterThanOrEqual(0.75e-6);
  });

  it('picks a thinner single wire when that already carries the current', () => {
    // 0.5 A needs 0.125 mm² → 0.4 mm (0.126 mm²) is thinner than 2δ
    const choice = chooseWire(0.5, 4e6, delta, wireSet, 8);
    expect(choice.strandDiameter).toBeCloseTo(0.4e-3, 12);
    expect(choice.strands).toBe(1);
  });

  it('goes to litz beyond the strand limit', () => {
    const choice = chooseWire(10, 4e6, delta, wireSet, 8);
    expect(choice.useLitz).toBe(true);
    expect(choice.options.some((w) => w.kind === 'litz')).toBe(true);
  });

  it('builds n-in-hand options from single wires', () => {
    const pair = roundWireInHand(wireSet, 0.5e-3, 2)!;
    expect(pair.strands).toBe(2);
    expect(pair.conductorsPerTurn).toBe(2);
  });
});
