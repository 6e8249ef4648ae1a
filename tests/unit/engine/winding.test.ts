import { describe, expect, it } from 'vitest';
import { ringMeanTurnLength, windingLayout } from '@shared/engine/winding';
import { chooseWire, roundWireInHand } from '@shared/engine/wire-choice';
import { copperSkinDepth } from '@shared/engine/skin-depth';
import { etd34Like, powderRing, roundWire, wireSet } from './fixtures';

describe('winding layout', () => {
  it('lays floor(bobbinWidth/(conductors·d_o)) turns per layer on a bobbin (common practice, no source)', () => {
    const wire = { ...roundWire(0.8e-3, 3), overallDiameter: 0.86e-3 };
    const layout = windingLayout(20, wire, etd34Like);
    // 21 mm / (3·0.86 mm) = 8.14 → 8 turns per layer, 20 turns → 3 layers, build 2.58 mm
    expect(layout.turnsPerLayer).toBe(8);
    expect(layout.layers).toBe(3);
    expect(layout.buildHeight * 1e3).toBeCloseTo(2.58, 9);
    expect(layout.fitsBuild).toBe(true);
    // copper fill Ku = N·strands·π·d²/4 / Wa (definition of window utilisation, computed)
    expect(layout.copperFill).toBeCloseTo((20 * 3 * Math.PI * 0.8e-3 ** 2) / 4 / 175e-6, 12);
    expect(layout.wireLength).toBeCloseTo(20 * 60e-3, 12);
  });

  it('puts floor(π·(ID − d_o)/d_o) turns on the first layer of a ring (common practice, no source)', () => {
    const wire = { ...roundWire(0.95e-3), overallDiameter: 1e-3 };
    // π·(14.7 − 1)/1 = 43.04 → 43
    const layout = windingLayout(60, wire, powderRing);
    expect(layout.turnsPerLayer).toBe(43);
    // second layer: π·(14.7 − 3)/1 = 36.8 → 36, so 60 turns take 2 layers
    expect(layout.layers).toBe(2);
    expect(layout.meanTurnLength).toBeCloseTo(ringMeanTurnLength(powderRing.ring!, 2e-3), 12);
  });

  it('reports a winding that does not fit the bobbin height', () => {
    const layout = windingLayout(200, roundWire(1.0e-3), etd34Like);
    expect(layout.fitsBuild).toBe(false);
    expect(layout.buildHeight).toBeGreaterThan(etd34Like.bobbinHeight);
    expect(layout.reason).toMatch(/^Winding needs \d+\.\d\d mm build height \(\d+ layers\), the bobbin allows 6\.00 mm\.$/);
    expect(windingLayout(20, roundWire(0.5e-3), etd34Like).reason).toBeUndefined();
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
    expect(choice.options[0]!.strands * Math.PI * (0.45e-3) ** 2 / 4).toBeGreaterThanOrEqual(0.75e-6);
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
