import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@shared/engine/index';
import { fringingFactor, gappedInductance } from '@shared/engine/gap';
import { CatalogueService } from '../../../server/catalogue/catalogue.service.ts';
import { runFieldCheck } from '../../../server/checks/field-check.ts';
import { solveFieldDesign } from '../../../server/solvers/field/design-field.ts';
import { planarCore, type FieldDesignInput } from '../../../server/solvers/field/design-model.ts';
import { ferriteA } from '../engine/fixtures.ts';

// The planar (x–y) field model of E and EFD cores (gmsh + GetDP, 'Vol' Jacobian, Az): (a) an ungapped E-shaped core
// against the magnetic circuit's closed form L = μ0·μr·N²·A/le; (b) a gapped catalogue E core against the engine's
// L = μ0·N²·Ae·F/(lg + le/μr) with McLyman's fringing factor F = 1 + (lg/√Ae)·ln(2G/lg) (C. W. T. McLyman, Transformer
// and Inductor Design Handbook, 3rd ed., Marcel Dekker 2004, ch. 8 — from memory); (c) a catalogue E core through the
// whole field check. No harmonic solve in (a) and (b): the inductance is the magnetostatic energy's.

const MU0 = 4e-7 * Math.PI;
const RHO = 1.7241e-8; // copper at 20 °C (IEC 60028)
const catalogue = new CatalogueService();
const wire = { kind: 'metric', strandDiameter: 0.5e-3, strands: 1, overallDiameter: 0.56e-3, conductorsPerTurn: 1 } as const;

describe('planar E core: the field against the magnetic circuit', () => {
  it('(a) ungapped, μr 2000: L within 3 % above μ0·μr·N²·A/le along the mean path', async () => {
    // An invented E-shaped section with slender members (centre leg 2 mm, each return path 1 mm, window 8 × 24 mm,
    // depth 10 mm), so the corners, where the mean path is uncertain, are a small part of the path.
    const [w, depth, width, height] = [2e-3, 10e-3, 8e-3, 24e-3];
    const core = {
      id: 'test E',
      ae: w * depth,
      windowArea: width * height,
      windowHeight: height,
      centreToOuterLegAreaRatio: 1,
      bobbinWidth: 22e-3,
    };
    const c = planarCore(core, w);
    expect(c.depth).toBeCloseTo(depth, 12);
    // Each half of the section is a frame of uniform member width s = w/2 round one window. Mean path: along each
    // member's centre line, round each corner on a quarter circle of radius s/2 (square corners would add (4 − π)·s).
    const s = w / 2;
    const le = 2 * (width + height) + Math.PI * s;
    const design: FieldDesignInput = {
      core,
      permeability: 2000,
      gap: { placement: 'ground', length: 0 },
      turns: 20,
      winding: { turnsPerLayer: 20, layers: 1 },
      wire,
      planar: { legWidth: w },
    };
    const field = await solveFieldDesign(design, { resistivity: RHO, frequencies: [] });
    const closed = (MU0 * 2000 * 400 * core.ae) / le;
    // The flux crowds to the inner (shorter) side of each member, so the field's L lies above the mean-path figure,
    // by roughly the corners' share of the path; 3 % bounds that for members 1/32 of the path wide (measured +1.2 %;
    // +2.2 % with every element halved). Leakage through the window air is μ0/(μ0·μr) smaller, ~0.1 %.
    const difference = field.inductance / closed - 1;
    expect(difference).toBeGreaterThan(0);
    expect(difference).toBeLessThan(0.03);
    // DC resistance: 40 straight runs (20 go, 20 return) of the depth, each of the wire's bare area (polygon of the circle).
    const straight = (40 * RHO * depth) / (Math.PI * (wire.strandDiameter / 2) ** 2);
    expect(Math.abs(field.dcResistance / straight - 1)).toBeLessThan(0.005);
    expect(field.model).toEqual({ kind: 'planar', depth });
  }, 60_000);

  it('(b) E20/10/6 gapped 0.1–1 mm: above the unfringed gap, below McLyman’s F; the section fringes at two of four faces', async () => {
    const core = catalogue.core('E20/10/6');
    const leg = catalogue.centreLeg('E20/10/6');
    if (leg?.shape !== 'rect') throw new Error('E20/10/6 has no rectangular centre leg in the catalogue');
    const design = (gap: number): FieldDesignInput => ({
      core,
      permeability: 2000,
      gap: { placement: 'ground', length: gap },
      turns: 20,
      winding: { turnsPerLayer: 10, layers: 2 },
      wire,
      planar: { legWidth: leg.width },
    });
    const solve = async (gap: number) => (await solveFieldDesign(design(gap), { resistivity: RHO, frequencies: [] })).inductance;
    // The section's own le from its ungapped inductance isolates the gap model (as gapped-core-field.test.ts does).
    const le = (MU0 * 2000 * 400 * core.ae) / (await solve(0));
    const depth = planarCore(core, leg.width).depth;
    // The leg's perimeter the section holds: the two faces x = ±w/2, each of the depth (the front and back are not in it).
    const share = (2 * depth) / (2 * depth + 2 * leg.width);
    for (const gap of [0.1e-3, 0.2e-3, 0.5e-3, 1e-3]) {
      const field = await solve(gap);
      const engine = gappedInductance(20, gap, core.ae, le, 2000, core.windowHeight);
      const plain = gappedInductance(20, gap, core.ae, le, 2000, core.windowHeight, false);
      // Measured (field against engine): −6.3 % at 0.1 mm, −9.8 % at 0.2, −17.1 % at 0.5, −25.1 % at 1 mm.
      expect(field).toBeGreaterThan(plain);
      expect(field).toBeLessThan(engine);
      // The fringing the field shows, as a fraction of McLyman's F − 1: at most the share of the perimeter the section
      // holds, at least half of it (measured 0.30 of a 0.47 share at every gap: the fringe per face is ~2/3 of McLyman's).
      const fringing = (field / plain - 1) / (fringingFactor(gap, core.ae, core.windowHeight) - 1);
      expect(fringing).toBeLessThan(share);
      expect(fringing).toBeGreaterThan(share / 2);
      if (gap === 0.1e-3) expect(Math.abs(field / engine - 1)).toBeLessThan(0.08);
    }
  }, 120_000);
});

describe('planar E core: the field check', () => {
  it('(c) a design on E25/13/7 through the whole field check is solved planar, with the depth stated', async () => {
    const core = catalogue.core('E25/13/7');
    const leg = catalogue.centreLeg('E25/13/7');
    const spec = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 4, frequency: 100e3, rippleRatio: 0.3, rectifier: 'ideal' } as const;
    const w = catalogue.wire({ kind: 'metric', strandDiameter: 0.8e-3, strands: 1 });
    const evaluation = evaluateDesign({ spec, core, material: ferriteA, turns: 'auto', gap: 'auto', placement: 'ground', wire: w });
    const progress: number[] = [];
    const result = await runFieldCheck(
      {
        evaluation,
        core,
        wire: w,
        permeability: ferriteA.permeability,
        ...(leg ? { centreLeg: leg } : {}),
        title: 'E25/13/7',
        harmonics: [1],
      },
      { onProgress: async (p) => void progress.push(p) },
    );
    expect(result.model).toBe('planar');
    expect(leg?.shape).toBe('rect');
    if (leg?.shape !== 'rect') return;
    expect(result.depth).toBeCloseTo(core.ae / leg.width, 12);
    expect(result.notes[0]).toContain(`Planar model, depth ${((core.ae / leg.width) * 1e3).toFixed(2)} mm`);
    // The gap fringes at two faces only: the field's L lies below the engine's, by less than McLyman's F − 1.
    const f = fringingFactor(evaluation.gap.total, core.ae, core.windowHeight);
    expect(result.inductance.difference).toBeLessThan(0);
    expect(result.inductance.difference).toBeGreaterThan(1 / f - 1);
    // Every turn twice in the picture (go and return), drawn as the planar section.
    expect(result.picture.match(/<circle/g)).toHaveLength(2 * evaluation.turns);
    expect(result.picture).toContain('planar cross-section');
    expect(result.acResistance[0]!.field).toBeGreaterThan(result.dcResistance);
    expect(progress.at(-1)).toBe(0.95);
  }, 90_000);
});
