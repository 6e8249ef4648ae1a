import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/auth';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

let t: TestApp;
let engineer: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
});
afterAll(() => t.close());

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

// Worked buck example: 24–36 V → 12 V, 10 A, 100 kHz, ripple 0.3 at Vin max; figures computed by hand from the ideal CCM
// buck relations (volt-second balance, Erickson & Maksimović, Fundamentals of Power Electronics — from memory).
const EXAMPLE_SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

describe('POST /api/calc/operating-point', () => {
  it('reproduces the worked buck example (ideal CCM buck relations, Erickson & Maksimović, Fundamentals of Power Electronics — from memory)', async () => {
    const res = await engineer.post('/api/calc/operating-point', EXAMPLE_SPEC);
    expect(res.status).toBe(200);
    const op = res.body;
    // L = Vout(1 − Vout/Vin,max)/(fs·r·Iout) = 12·(2/3)/(1e5·0.3·10) = 26.67 µH [C]
    expect(relative(op.inductanceMin, 26.667e-6)).toBeLessThan(1e-3);
    expect(op.dutyAtVinMin).toBeCloseTo(0.5, 6); // D = Vout/Vin ideal
    expect(op.dutyAtVinMax).toBeCloseTo(1 / 3, 6);
    expect(op.rippleAtVinMax).toBeCloseTo(3, 4); // 0.3 × 10 A
    expect(op.peakCurrent).toBeCloseTo(11.5, 4); // Iout + ΔI/2
    expect(op.rmsCurrent).toBeCloseTo(Math.sqrt(100 + 9 / 12), 4); // 10.04 A, sqrt(Iout² + ΔI²/12)
    expect(relative(op.storedEnergy, 0.5 * 26.667e-6 * 11.5 ** 2)).toBeLessThan(1e-3); // ½·L·Ipk² = 1.763 mJ
    expect(op.ccmBoundaryCurrent).toBeCloseTo(1.5, 4); // ΔI/2
  });

  it('returns ripple harmonics whose squared sum approaches ΔI²/12 (Parseval on the Fourier series of the triangle, computed)', async () => {
    const res = await engineer.post('/api/calc/operating-point', EXAMPLE_SPEC);
    const harmonics = res.body.harmonics as { n: number; amplitude: number }[];
    expect(harmonics[0]).toMatchObject({ n: 1 });
    const sum = harmonics.reduce((s, h) => s + h.amplitude ** 2 / 2, 0);
    const target = 3 ** 2 / 12;
    expect(sum / target).toBeGreaterThan(0.995);
    expect(sum / target).toBeLessThanOrEqual(1 + 1e-9);
    // D = 1/3: the third harmonic vanishes (n·D an integer)
    expect(harmonics[2].amplitude).toBeLessThan(1e-9);
  });

  it('uses the controller current limit for the saturation check current', async () => {
    const res = await engineer.post('/api/calc/operating-point', { ...EXAMPLE_SPEC, currentLimit: 14 });
    expect(res.body.saturationCheckCurrent).toBe(14);
  });

  it.each([
    [{ ...EXAMPLE_SPEC, vout: 30 }, 'vout', /below vinMin/],
    [{ ...EXAMPLE_SPEC, frequency: -100e3 }, 'frequency', /between 1000 and 10000000 Hz/],
    [{ ...EXAMPLE_SPEC, frequency: 'fast' }, 'frequency', /finite number/],
    [{ ...EXAMPLE_SPEC, rippleRatio: undefined }, 'rippleRatio', /exactly one/],
    [{ ...EXAMPLE_SPEC, inductance: 10e-6 }, 'inductance', /exactly one/],
    [{ ...EXAMPLE_SPEC, colour: 'red' }, 'colour', /Unknown field/],
    [{ ...EXAMPLE_SPEC, vinMin: 40 }, 'vinMin', /must not exceed vinMax/],
    [{ ...EXAMPLE_SPEC, ioutMax: 1e308 }, 'ioutMax', /between/],
  ])('refuses bad input %# with 400 naming the field', async (body, field, message) => {
    const res = await engineer.post('/api/calc/operating-point', body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields[field]).toMatch(message);
  });

  it('refuses a spec that is in DCM at full load, naming the ripple field', async () => {
    const res = await engineer.post('/api/calc/operating-point', { ...EXAMPLE_SPEC, rippleRatio: undefined, inductance: 1e-6 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['inductance']);
    expect(res.body.error.message).toMatch(/DCM|discontinuous/i);
  });
});

describe('POST /api/calc/core-loss', () => {
  const material = { k: 2, alpha: 1.5, beta: 2.5 };

  it('evaluates Steinmetz at the peak flux ΔB/2 (Steinmetz equation as restated in Szczerba & Worek, Electronics 14 (2025) 2883)', async () => {
    const res = await engineer.post('/api/calc/core-loss', { material, frequency: 100e3, deltaB: 0.2, duty: 0.5, waveform: 'sine' });
    expect(res.status).toBe(200);
    // 2·(1e5)^1.5·(0.1)^2.5 = 2·3.1623e7·3.1623e-3 = 2.0e5 W/m³ [C]
    expect(relative(res.body.steinmetz, 2.0e5)).toBeLessThan(1e-9);
    // A sinusoid through the iGSE reproduces Steinmetz (Venkatachalam et al. 2002)
    expect(relative(res.body.igse, res.body.steinmetz)).toBeLessThan(1e-3);
  });

  it.each([
    [0.5, 0.9129],
    [0.2, 1.0826],
    [0.1, 1.361],
  ])(
    'gives iGSE/Steinmetz = %s → %s for a triangle at α = 1.5 (computed from the iGSE of Venkatachalam, Sullivan, Abdallah, Tacca, COMPEL 2002)',
    async (duty, ratio) => {
      const res = await engineer.post('/api/calc/core-loss', { material, frequency: 100e3, deltaB: 0.2, duty, waveform: 'triangle' });
      expect(res.body.igse / res.body.steinmetz).toBeCloseTo(ratio, 3);
    },
  );

  it('refuses α out of range and a duty of 1, naming the fields', async () => {
    const res = await engineer.post('/api/calc/core-loss', {
      material: { ...material, alpha: 5 },
      frequency: 100e3,
      deltaB: 0.2,
      duty: 1,
      waveform: 'triangle',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['material.alpha']).toMatch(/between 1 and 3/);
    expect(res.body.error.fields['duty']).toMatch(/between 0 and 1/);
  });
});

describe('POST /api/calc/search and /api/calc/evaluate', () => {
  async function demoMaterialIds(): Promise<string[]> {
    const res = await engineer.get('/api/materials');
    expect(res.status).toBe(200);
    return res.body.materials.map((m: { id: string }) => m.id);
  }

  it('ranks feasible candidates by total loss, marks a Pareto front, and explains infeasible ones', async () => {
    const materialIds = await demoMaterialIds();
    expect(materialIds.length).toBeGreaterThanOrEqual(5);
    const res = await engineer.post('/api/calc/search', { spec: EXAMPLE_SPEC, materialIds, rankBy: 'loss', limit: 10 });
    expect(res.status).toBe(200);
    // The search's own server time, for browser tools and the bench (W3C Server Timing).
    expect(res.headers['server-timing']).toMatch(/^search;desc="[^"]+";dur=\d+(\.\d)?$/);
    const { candidates, infeasible, counts } = res.body;
    expect(counts.evaluated).toBeGreaterThan(100);
    expect(candidates.length).toBeGreaterThan(0);
    const losses = candidates.map((c: { result: { totalLoss: number } }) => c.result.totalLoss);
    expect([...losses].sort((a, b) => a - b)).toEqual(losses);
    expect(candidates.some((c: { pareto: boolean }) => c.pareto)).toBe(true);
    for (const c of candidates) expect(c.result.feasible).toBe(true);
    expect(infeasible.length).toBeGreaterThan(0);
    expect(infeasible[0].reasons[0].message).toMatch(/\w+/);
    // The smallest cores cannot hold the energy: they are reported with the area-product reason.
    expect(infeasible.some((i: { reasons: { message: string }[] }) => i.reasons.some((r) => /area product/i.test(r.message)))).toBe(true);
  });

  it('evaluates the winning candidate by hand to the same figures', async () => {
    const materialIds = await demoMaterialIds();
    const search = await engineer.post('/api/calc/search', { spec: EXAMPLE_SPEC, materialIds, limit: 1 });
    const best = search.body.candidates[0];
    const res = await engineer.post('/api/calc/evaluate?sweep=frequency', {
      spec: EXAMPLE_SPEC,
      coreId: best.result.core.id,
      materialId: best.result.material.id,
      turns: best.result.turns,
      // A spacer design is given by its spacer thickness.
      placement: best.placement,
      gap: best.placement === 'spacer' ? best.result.gap.spacer : best.result.gap.total,
      // The search may have moved the copper further from the gap than the default keep-out.
      keepOut: best.result.winding.keepOut,
      wire: { kind: best.wire.kind, strandDiameter: best.wire.strandDiameter, strands: best.wire.strands },
    });
    expect(res.status).toBe(200);
    expect(relative(res.body.result.totalLoss, best.result.totalLoss)).toBeLessThan(1e-6);
    expect(res.body.lossVersusFrequency.length).toBeGreaterThan(5);
    expect(res.body.lossMap).toBeUndefined();
  });

  it('adds the loss map from 10 % to 100 % load at three input voltages when asked, and refuses an unknown sweep', async () => {
    const materialIds = await demoMaterialIds();
    const search = await engineer.post('/api/calc/search', { spec: EXAMPLE_SPEC, materialIds, limit: 1 });
    const best = search.body.candidates[0];
    const body = {
      spec: EXAMPLE_SPEC,
      coreId: best.result.core.id,
      materialId: best.result.material.id,
      turns: best.result.turns,
      gap: best.result.gap.total,
      wire: { kind: best.wire.kind, strandDiameter: best.wire.strandDiameter, strands: best.wire.strands },
    };
    const res = await engineer.post('/api/calc/evaluate?sweep=all', body);
    expect(res.status).toBe(200);
    expect(res.body.lossVersusFrequency.length).toBeGreaterThan(5);
    expect(res.body.lossMap.points).toHaveLength(30);
    expect(new Set(res.body.lossMap.points.map((p: { corner: string }) => p.corner))).toEqual(new Set(['min', 'nominal', 'max']));
    const refused = await engineer.post('/api/calc/evaluate?sweep=everything', body);
    expect(refused.status).toBe(400);
    expect(JSON.stringify(refused.body)).toMatch(/sweep/);
  });

  it('evaluates a candidate the search moved further from the gap (keepOut) to the same figures', async () => {
    const materialIds = await demoMaterialIds();
    const search = await engineer.post('/api/calc/search', { spec: EXAMPLE_SPEC, materialIds, limit: 200 });
    expect(search.status).toBe(200);
    interface Candidate {
      placement: string;
      wire: { kind: string; strandDiameter: number; strands: number };
      result: {
        core: { id: string };
        material: { id: string };
        turns: number;
        gap: { total: number; spacer: number };
        totalLoss: number;
        winding: { keepOut: number };
        copper: { gapLoss: number };
      };
    }
    const moved = (search.body.candidates as Candidate[]).find((c) => c.result.winding.keepOut > 0.5e-3);
    expect(moved, 'a candidate with more keep-out than the limit').toBeDefined();
    const body = {
      spec: EXAMPLE_SPEC,
      coreId: moved!.result.core.id,
      materialId: moved!.result.material.id,
      turns: moved!.result.turns,
      placement: moved!.placement,
      gap: moved!.placement === 'spacer' ? moved!.result.gap.spacer : moved!.result.gap.total,
      wire: { kind: moved!.wire.kind, strandDiameter: moved!.wire.strandDiameter, strands: moved!.wire.strands },
    };
    const res = await engineer.post('/api/calc/evaluate', { ...body, keepOut: moved!.result.winding.keepOut });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.result.winding.keepOut).toBe(moved!.result.winding.keepOut);
    expect(relative(res.body.result.totalLoss, moved!.result.totalLoss)).toBeLessThan(1e-9);
    expect(relative(res.body.result.copper.gapLoss, moved!.result.copper.gapLoss)).toBeLessThan(1e-9);
    // Without it the design falls back to the limit's keep-out: nearer the gap, more gap-field loss.
    const atLimit = await engineer.post('/api/calc/evaluate', body);
    expect(atLimit.body.result.winding.keepOut).toBe(0.5e-3);
    expect(atLimit.body.result.copper.gapLoss).toBeGreaterThan(moved!.result.copper.gapLoss);
    // The search moves copper away only where the gap-field loss is at least 2 % of the total; from that share
    // evaluate adds the image method's cross-check of it.
    expect(atLimit.body.result.copper.gapLoss / atLimit.body.result.totalLoss).toBeGreaterThanOrEqual(0.02);
    // … when asked with a sweep, as the design page asks: a plain evaluate stays as cheap as before.
    expect(atLimit.body.gapLossByWindowImages).toBeUndefined();
    const withSweep = await engineer.post('/api/calc/evaluate?sweep=frequency', body);
    expect(withSweep.body.gapLossByWindowImages).toBeGreaterThan(0);
    const refused = await engineer.post('/api/calc/evaluate', { ...body, keepOut: -1e-3 });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toContain('keepOut');
  });

  it('changing the turns by hand changes the losses', async () => {
    const materialIds = await demoMaterialIds();
    const search = await engineer.post('/api/calc/search', { spec: EXAMPLE_SPEC, materialIds, limit: 1 });
    const best = search.body.candidates[0];
    const body = (turns: number) => ({
      spec: EXAMPLE_SPEC,
      coreId: best.result.core.id,
      materialId: best.result.material.id,
      turns,
      gap: 'auto',
      wire: { kind: best.wire.kind, strandDiameter: best.wire.strandDiameter, strands: best.wire.strands },
    });
    const more = await engineer.post('/api/calc/evaluate', body(best.result.turns + 4));
    expect(more.status).toBe(200);
    expect(more.body.result.copper.dcLoss).toBeGreaterThan(best.result.copper.dcLoss);
    expect(more.body.result.flux.peak).toBeLessThan(best.result.flux.peak);
  });

  it('refuses an unknown core and an unknown material by field', async () => {
    const base = { spec: EXAMPLE_SPEC, turns: 'auto', gap: 'auto', wire: { kind: 'awg', awg: 18, strands: 2 } };
    const core = await engineer.post('/api/calc/evaluate', { ...base, coreId: 'XX99', materialId: '1' });
    expect(core.status).toBe(400);
    expect(core.body.error.fields).toHaveProperty('coreId');
    const material = await engineer.post('/api/calc/evaluate', { ...base, coreId: 'ETD34/17/11', materialId: '999999' });
    expect(material.status).toBe(400);
    expect(material.body.error.fields).toHaveProperty('materialId');
    const none = await engineer.post('/api/calc/search', { spec: EXAMPLE_SPEC });
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toHaveProperty('materialIds');
  });
});

describe('inline materials in our own terms', () => {
  // An invented powder: T0 = 90 °C, F0 = 1, c = 1e-4 is the engine's 1e-4·T² − 0.018·T + 1.81, and H½ = 5000 A/m,
  // n = 1.8 is 1/(1 + 5000^−1.8·H^1.8) (algebra, no source).
  const POWDER = {
    name: 'Inline powder (invented)',
    family: 'powder',
    k: 60,
    alpha: 1.3,
    beta: 2.2,
    fitFrequencyMin: 1e4,
    fitFrequencyMax: 5e5,
    fitFluxMin: 0.005,
    fitFluxMax: 0.4,
    bsat25: 1,
    bsat100: 0.95,
    permeability: 60,
    density: 7000,
  };
  const named = {
    ...POWDER,
    temperatureBehaviour: { lowestLossTemperature: 90, lowestLossFactor: 1, curvature: 1e-4 },
    rollOffCurve: { halfField: 5000, steepness: 1.8 },
  };
  const engineForm = { ...POWDER, tempCoefficients: { ct0: 1.81, ct1: 0.018, ct2: 1e-4 }, rollOff: { a: 1, b: 5000 ** -1.8, c: 1.8 } };
  const evaluate = (material: object) =>
    engineer.post('/api/calc/evaluate', {
      spec: EXAMPLE_SPEC,
      coreId: 'T46.7/24.1/18.0',
      material,
      turns: 'auto',
      gap: 'auto',
      wire: { kind: 'awg', awg: 18, strands: 2 },
    });

  it('gives the same result as the engine constants they stand for', async () => {
    const [a, b] = await Promise.all([evaluate(named), evaluate(engineForm)]);
    expect(a.status, JSON.stringify(a.body)).toBe(200);
    expect(b.status).toBe(200);
    expect(relative(a.body.result.totalLoss, b.body.result.totalLoss)).toBeLessThan(1e-9);
    expect(a.body.result.turns).toBe(b.body.result.turns);
  });

  it('refuses both forms of one quantity, naming the field', async () => {
    const res = await evaluate({ ...named, rollOff: engineForm.rollOff });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['material.rollOffCurve']).toMatch(/not both/);
  });
});

describe.each<[Role | 'anonymous', number]>([
  ['anonymous', 401],
  ['engineer', 200],
  ['reviewer', 200],
  ['winder', 200],
  ['admin', 200],
])('calculation routes as %s', (role, expected) => {
  it(`answer ${expected}`, async () => {
    const client = await signedInAs(t.app, role);
    expect((await client.post('/api/calc/operating-point', EXAMPLE_SPEC)).status).toBe(expected);
    expect(
      (
        await client.post('/api/calc/core-loss', {
          material: { k: 2, alpha: 1.5, beta: 2.5 },
          frequency: 1e5,
          deltaB: 0.1,
          duty: 0.3,
          waveform: 'triangle',
        })
      ).status,
    ).toBe(expected);
  });
});
