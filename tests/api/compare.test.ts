import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MATERIAL_CSV_COLUMNS } from '@shared/schemas/materials';
import { signedInAs, type ApiClient } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

let t: TestApp;
let engineer: ApiClient;
let knownId: string;
beforeAll(async () => {
  t = await createTestApp();
  engineer = await signedInAs(t.app, 'engineer');
  // A material with round coefficients so the expected losses can be worked out by hand.
  const cells: Record<string, string> = {
    name: 'Round-number ferrite',
    family: 'ferrite',
    unit_set: 'W/m3-Hz-T',
    k: '1',
    alpha: '1.5',
    beta: '2.5',
    f_min: '50000',
    f_max: '300000',
    b_min: '0.02',
    b_max: '0.2',
    bsat_25: '0.5',
    bsat_100: '0.4',
    mu_i: '2000',
    density: '4800',
    provenance: 'Invented for a test',
  };
  const csv = `${MATERIAL_CSV_COLUMNS.join(',')}\n${MATERIAL_CSV_COLUMNS.map((c) => cells[c] ?? '').join(',')}\n`;
  const res = await engineer.agent
    .post('/api/materials/import/commit')
    .set('X-XSRF-TOKEN', engineer.csrfToken ?? '')
    .attach('file', Buffer.from(csv), 'round.csv');
  knownId = String(res.body.materialIds[0]);
});
afterAll(() => t.close());

const EXAMPLE_SPEC = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

describe('POST /api/compare/curves', () => {
  it('gives Steinmetz with the peak flux ΔB/2 and flags points outside the fitted range', async () => {
    const res = await engineer.post('/api/compare/curves', {
      materialIds: [knownId],
      deltaB: 0.2,
      frequency: 100e3,
      duty: 0.5,
      frequencyRange: { min: 10e3, max: 1e6 },
      fluxRange: { min: 0.01, max: 1 },
      points: 5,
    });
    expect(res.status).toBe(200);
    const [curves] = res.body.materials;
    // Steinmetz Pv = k·f^α·B̂^β (as restated in Szczerba & Worek, Electronics 14 (2025) 2883): 1·(1e5)^1.5·(0.1)^2.5 = 3.162e7·3.162e-3 = 1.000e5 W/m³, by hand
    const at100k = curves.versusFrequency.find((p: { x: number }) => Math.abs(p.x - 1e5) < 1);
    expect(at100k.steinmetz).toBeCloseTo(1e5, -1);
    expect(at100k.extrapolated).toBe(false);
    // 10 kHz and 1 MHz lie outside the 50–300 kHz fit
    expect(curves.versusFrequency[0].extrapolated).toBe(true);
    expect(curves.versusFrequency[4].extrapolated).toBe(true);
    // ΔB = 1 T is B̂ = 0.5 T, above the 0.2 T fit
    expect(curves.versusFlux[4].extrapolated).toBe(true);
    // The log sweep is geometric: 10 k, 31.6 k, 100 k, 316 k, 1 M
    expect(curves.versusFrequency[1].x).toBeCloseTo(31622.8, 0);
    // Loss grows as f^α along the frequency sweep: ratio of a decade = 10^1.5
    expect(curves.versusFrequency[4].igse / curves.versusFrequency[2].igse).toBeCloseTo(10 ** 1.5, 6);
    expect(curves.fit).toEqual({ frequencyMin: 50000, frequencyMax: 300000, fluxMin: 0.02, fluxMax: 0.2 });
  });

  it('puts the curves at a core temperature with the material’s temperature factor, as the engine does', async () => {
    const library = await engineer.get('/api/materials/library');
    const ferrite = (library.body.materials as { id: string; tempCoefficients?: { ct0: number; ct1: number; ct2: number } }[]).find(
      (m) => m.tempCoefficients,
    )!;
    const body = { materialIds: [ferrite.id], points: 5 };
    const plain = await engineer.post('/api/compare/curves', body);
    const hot = await engineer.post('/api/compare/curves', { ...body, temperature: 40 });
    expect(hot.status).toBe(200);
    expect(plain.body.temperature).toBeNull();
    expect(hot.body.temperature).toBe(40);
    // The factor ct2·T² − ct1·T + ct0 at 40 °C, by hand from the listed (referred) coefficients.
    const { ct0, ct1, ct2 } = ferrite.tempCoefficients!;
    const factor = ct2 * 40 ** 2 - ct1 * 40 + ct0;
    expect(factor).toBeGreaterThan(1);
    const [before, after] = [plain.body.materials[0].versusFrequency[2], hot.body.materials[0].versusFrequency[2]];
    expect(after.igse / before.igse).toBeCloseTo(factor, 12);
    expect(after.steinmetz / before.steinmetz).toBeCloseTo(factor, 12);
    const refused = await engineer.post('/api/compare/curves', { ...body, temperature: 400 });
    expect(refused.body.error.fields.temperature).toMatch(/between -60 and 250/);
  });

  it('names the field of a bad request', async () => {
    const empty = await engineer.post('/api/compare/curves', { materialIds: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.materialIds).toMatch(/at least one/);
    const unknown = await engineer.post('/api/compare/curves', { materialIds: ['999999'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields['materialIds.0']).toMatch(/Unknown material/);
    const range = await engineer.post('/api/compare/curves', { materialIds: [knownId], frequencyRange: { min: 2e6, max: 1e6 } });
    expect(range.body.error.fields['frequencyRange.min']).toMatch(/below/);
  });
});

describe('POST /api/compare/design', () => {
  /** ETD34 with 20 turns of two AWG 18 in hand, on the example converter; a test changes one part. */
  const typedDesign = (change: Record<string, unknown> = {}) =>
    engineer.post('/api/compare/design', {
      spec: EXAMPLE_SPEC,
      coreId: 'ETD34/17/11',
      turns: 20,
      wire: { kind: 'awg', awg: 18, strands: 2 },
      ...change,
    });

  it('evaluates one design with every current material; powders are incompatible with a gapped set', async () => {
    const res = await typedDesign();
    expect(res.status).toBe(200);
    const rows = res.body.rows as {
      name: string;
      family: string;
      status: string;
      reason?: string;
      coreLoss?: number;
      totalLoss?: number;
      gap?: number;
    }[];
    const materials = (await engineer.get('/api/materials')).body.materials as unknown[];
    expect(rows).toHaveLength(materials.length);
    const powder = rows.find((r) => r.family === 'powder')!;
    expect(powder.status).toBe('incompatible');
    expect(powder.reason).toMatch(/ring or toroid/);
    const ferrites = rows.filter((r) => r.status === 'ok');
    expect(ferrites.length).toBeGreaterThan(1);
    for (const r of ferrites) {
      expect(r.coreLoss).toBeGreaterThan(0);
      expect(r.totalLoss).toBeGreaterThan(r.coreLoss!);
      expect(r.gap).toBeGreaterThan(0);
    }
  });

  it('keeps a spacer design a spacer design: each row gives the spacer that material needs', async () => {
    const [ground, spacer] = await Promise.all([typedDesign(), typedDesign({ placement: 'spacer' })]);
    expect(spacer.status).toBe(200);
    expect([ground.body.placement, spacer.body.placement]).toEqual(['ground', 'spacer']);
    const okRows = (body: { rows: { materialId: string; status: string; gap?: number }[] }) => body.rows.filter((r) => r.status === 'ok');
    for (const row of okRows(spacer.body)) {
      const evaluated = await engineer.post('/api/calc/evaluate', {
        spec: EXAMPLE_SPEC,
        coreId: 'ETD34/17/11',
        materialId: row.materialId,
        turns: 20,
        gap: 'auto',
        placement: 'spacer',
        wire: { kind: 'awg', awg: 18, strands: 2 },
      });
      expect(evaluated.status).toBe(200);
      expect(row.gap).toBeCloseTo(evaluated.body.result.gap.spacer, 12);
      // Two gaps in series, each fringing less than one gap of twice the length (McLyman's F = 1 + (lg/√A)·ln(2G/lg)
      // grows with lg; Transformer and Inductor Design Handbook, 3rd ed., ch. 8): the spacer of the same inductance
      // is thinner than half the ground gap, and with outer legs of about the centre leg's area not far below it.
      const groundGap = okRows(ground.body).find((r) => r.materialId === row.materialId)!.gap!;
      expect(row.gap!).toBeLessThan(groundGap / 2);
      expect(row.gap!).toBeGreaterThan(groundGap / 4);
    }
    expect((await typedDesign({ placement: 'wedge' })).status).toBe(400);
  });

  it('refuses an unknown core by field', async () => {
    const res = await typedDesign({ coreId: 'NOPE' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.coreId).toMatch(/Unknown core/);
  });
});

describe('POST /api/compare/saved-design', () => {
  const SPEC = { converter: { ...EXAMPLE_SPEC, rectifier: 'ideal' } };
  const construction = () => ({
    coreId: 'ETD39/20/13',
    materialId: knownId,
    turns: 'auto',
    gap: 'auto',
    wire: { kind: 'awg', awg: 16, strands: 2 },
  });
  interface Row {
    materialId: string;
    status: string;
    usedByDesign?: boolean;
    coreLoss?: number;
    totalLoss?: number;
    gap?: number;
  }

  it("evaluates a saved revision's core, turns and wire with every material, its own material marked", async () => {
    const created = await engineer.post('/api/designs', { title: 'Saved comparison', spec: SPEC, construction: construction() });
    expect(created.status).toBe(201);
    const saved = created.body.latest as {
      revision: number;
      construction: { turns: number; gap: number };
      result: { evaluation: { coreLoss: { loss: number }; totalLoss: number } };
    };

    const res = await engineer.post('/api/compare/saved-design', { designId: created.body.id, revision: saved.revision });
    expect(res.status).toBe(200);
    expect(res.body.design).toMatchObject({ id: created.body.id, number: created.body.number, revision: 1, materialId: knownId });
    expect(res.body.coreId).toBe('ETD39/20/13');
    expect(res.body.turns).toBe(saved.construction.turns);
    const rows = res.body.rows as Row[];
    const own = rows.find((r) => r.materialId === knownId)!;
    expect(own.usedByDesign).toBe(true);
    expect(rows.filter((r) => r.usedByDesign)).toHaveLength(1);
    // Same engine, material, core, turns and wire as the saved result: the comparison reproduces its figures.
    expect(own.coreLoss).toBeCloseTo(saved.result.evaluation.coreLoss.loss, 9);
    expect(own.totalLoss).toBeCloseTo(saved.result.evaluation.totalLoss, 9);
    expect(own.gap).toBeCloseTo(saved.construction.gap, 12);

    // The flux point to draw the curves at: ideal buck D = Vout/Vin,max = 12/36, ΔB = (Vin,max − Vout)·D/(fs·N·Ae)
    // (volt-second balance, Erickson & Maksimović, Fundamentals of Power Electronics — from memory), the same for every material on this core.
    const cores = (await engineer.get('/api/catalogue/cores')).body.cores as { id: string; ae: number }[];
    const ae = cores.find((c) => c.id === 'ETD39/20/13')!.ae;
    const n = saved.construction.turns;
    expect(res.body.fluxPoint.duty).toBeCloseTo(1 / 3, 12);
    expect(res.body.fluxPoint.frequency).toBe(100e3);
    expect(res.body.fluxPoint.deltaB).toBeCloseTo(((36 - 12) * (1 / 3)) / (100e3 * n * ae), 9);
  });

  it("keeps the revision's own material version after the material was edited", async () => {
    const created = await engineer.post('/api/designs', { title: 'Before the edit', spec: SPEC, construction: construction() });
    const edited = await engineer.patch(`/api/materials/${knownId}`, { beta: 2.6 });
    expect(edited.status).toBe(201);
    const res = await engineer.post('/api/compare/saved-design', { designId: created.body.id, revision: 1 });
    expect(res.status).toBe(200);
    const rows = res.body.rows as Row[];
    const ids = rows.map((r) => r.materialId);
    expect(ids).toContain(knownId);
    expect(ids).toContain(String(edited.body.id));
    expect(rows.find((r) => r.materialId === knownId)!.usedByDesign).toBe(true);
    // Pv ∝ B̂^β with B̂ < 1 T: a larger β gives a smaller loss (Steinmetz equation as restated in Szczerba & Worek, Electronics 14 (2025) 2883).
    const before = rows.find((r) => r.materialId === knownId)!.coreLoss!;
    const after = rows.find((r) => r.materialId === String(edited.body.id))!.coreLoss!;
    expect(after).toBeLessThan(before);
    knownId = String(edited.body.id);
  });

  it('says what is missing: unknown design, a revision without a construction, a malformed body', async () => {
    const unknown = await engineer.post('/api/compare/saved-design', { designId: 999999, revision: 1 });
    expect(unknown.status).toBe(404);
    const bare = await engineer.post('/api/designs', { title: 'Only a spec', spec: SPEC });
    const empty = await engineer.post('/api/compare/saved-design', { designId: bare.body.id, revision: 1 });
    expect(empty.status).toBe(409);
    expect(empty.body.error.fields.revision).toMatch(/No construction/);
    const noRevision = await engineer.post('/api/compare/saved-design', { designId: bare.body.id, revision: 7 });
    expect(noRevision.status).toBe(404);
    const malformed = await engineer.post('/api/compare/saved-design', { designId: 'GW-0001', revision: 0 });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields.designId).toMatch(/design id/);
    expect(malformed.body.error.fields.revision).toMatch(/revision number/);
  });
});
