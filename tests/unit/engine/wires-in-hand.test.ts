import { describe, expect, it } from 'vitest';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { roundWire, sectionOneSpec, workedDesign } from './fixtures';

// Wires in hand side by side see different fields and share the ripple unequally unless twisted or transposed (common
// practice, no source); the engine's Dowell loss assumes equal sharing, so it says so where the AC loss matters.
const base: EvaluateInput = workedDesign;
const warned = (input: EvaluateInput) => evaluateDesign(input).issues.some((i) => i.code === 'wires-in-hand');

describe('wires in hand', () => {
  it('warns for several round wires in hand when the ripple sees more than 10 % AC resistance', () => {
    const result = evaluateDesign(base);
    expect(result.copper.acFactor).toBeGreaterThan(1.1);
    expect(warned(base)).toBe(true);
    expect(result.issues.find((i) => i.code === 'wires-in-hand')!.message).toMatch(/^3 wires in hand .* twisted together or transposed/);
  });

  it('does not warn for one wire, nor where the AC resistance hardly matters', () => {
    expect(warned({ ...base, wire: roundWire(0.8e-3, 1) })).toBe(false);
    const thin = { ...base, wire: roundWire(0.1e-3, 3), spec: { ...sectionOneSpec, frequency: 20e3 } };
    expect(evaluateDesign(thin).copper.acFactor).toBeLessThanOrEqual(1.1);
    expect(warned(thin)).toBe(false);
  });
});

describe('foil beside a gap', () => {
  it('warns of the gap field on foil and counts its loss on the design (common practice, no source: foil near a gap runs hot)', () => {
    const foil = evaluateDesign({
      ...base,
      wire: { id: 'foil 0.15', kind: 'foil', strandDiameter: 0.15e-3, overallDiameter: 0.2e-3, strands: 1, conductorsPerTurn: 1 },
    });
    expect(foil.issues.some((i) => i.code === 'foil-beside-gap')).toBe(true);
    // The design's own evaluation includes the foil's gap-field loss (foil-gap-loss.ts): it is no longer zero.
    expect(foil.copper.gapLoss).toBeGreaterThan(0);
    expect(warned(base)).toBe(true);
    expect(evaluateDesign(base).issues.some((i) => i.code === 'foil-beside-gap')).toBe(false);
  });
});
