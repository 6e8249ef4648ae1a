import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@shared/engine/evaluate';
import { readStoredResult } from '@shared/schemas/designs';
import { ferriteA, powderP, powderRing, roundWire, sectionOneSpec, etd34Like } from '../engine/fixtures';

const evaluate = (core = etd34Like, material = ferriteA) =>
  evaluateDesign({ spec: sectionOneSpec, core, material, turns: 'auto', gap: 'auto', wire: roundWire(0.8e-3, 3) });
const stored = (evaluation: unknown) => ({ wire: roundWire(0.8e-3, 3), evaluation });

describe('stored results and the two-node thermal figures', () => {
  it('reads a result saved before the network: volume law on any core, a hot-spot allowance, no node temperatures', () => {
    const today = evaluate();
    const { coreTemperature: _c, windingTemperature: _w, ...rest } = today.thermal;
    const old = { ...today, thermal: { ...rest, riseByVolume: 21.5, hotSpotAllowance: 5 } };
    const { result, resultUnreadable } = readStoredResult(JSON.parse(JSON.stringify(stored(old))));
    expect(resultUnreadable).toBeNull();
    expect(result?.evaluation.thermal.coreTemperature).toBeUndefined();
    expect(result?.evaluation.thermal.hotSpotAllowance).toBe(5);
  });

  it('keeps a ring core without the core-volume law (null) and with both node temperatures through JSON', () => {
    const ring = evaluate(powderRing, powderP);
    expect(ring.thermal.riseByVolume).toBeNull();
    const { result, resultUnreadable } = readStoredResult(JSON.parse(JSON.stringify(stored(ring))));
    expect(resultUnreadable).toBeNull();
    expect(result?.evaluation.thermal.riseByVolume).toBeNull();
    expect(result?.evaluation.thermal.coreTemperature).toBe(ring.thermal.coreTemperature);
    expect(result?.evaluation.thermal.windingTemperature).toBe(ring.thermal.windingTemperature);
  });
});
