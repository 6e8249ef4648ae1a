// The search as a designer would use it, on the six example converters A–F (tests/support/example-specs.ts), the
// shipped catalogue and the invented demo materials. Each finding of the expert-search issue has a check that
// failed before the search was rebuilt (figures before are in the comments).
import { describe, expect, it } from 'vitest';
import { loadCoreCatalogue } from '@core-data/catalogue';
import { loadStandardWireOptions } from '@core-data/wire-catalogue';
import { standardFoilOptions } from '@shared/catalogue/foil';
import { compatible, searchCandidates, type SearchInput, type SearchResult } from '@shared/engine/search';
import { CandidateFigures, evaluateCandidate, prepareCore, prepareMaterial, prepareSpec, prepareWire } from '@shared/engine/kernel';
import { designMagnetics } from '@shared/engine/magnetic-design';
import { RANK_BY } from '@shared/engine/ranking';
import type { CoreMaterial } from '@shared/engine/types';
import { EXAMPLE_SPECS } from '../../support/example-specs';
import { DEMO_ENGINE_MATERIALS } from '../../support/demo-engine-materials';

const cores = loadCoreCatalogue();
const wires = [...loadStandardWireOptions(), ...standardFoilOptions()];
const materials = DEMO_ENGINE_MATERIALS;
const everything = { offset: 0, limit: 100_000 };

function search(spec: SearchInput['spec'], extra: Partial<SearchInput> = {}): SearchResult {
  return searchCandidates({ spec, cores, materials, wires, ...extra });
}

describe('the default objective: the smallest part that meets every limit', () => {
  it('A: proposes a small core, not the largest one with two turns', () => {
    // Before: #1 E65/32/27, 2 turns, Ve 79 cm³, 66,746 × the required area product.
    const best = search(EXAMPLE_SPECS.A).candidates[0]!;
    expect(best.volume).toBeLessThan(1e-6);
    expect(best.result.core.areaProductAvailable / best.result.core.areaProductRequired).toBeLessThan(1000);
  });

  it.each(Object.keys(EXAMPLE_SPECS))('%s: every proposal meets every limit and the first is the smallest in-fit part', (label) => {
    const result = search(EXAMPLE_SPECS[label as keyof typeof EXAMPLE_SPECS], everything);
    expect(result.candidates.length).toBe(result.page.total);
    for (const c of result.candidates) {
      expect(c.result.feasible).toBe(true);
      expect(c.result.issues.filter((i) => i.severity === 'error')).toEqual([]);
    }
    const inFit = result.candidates.filter((c) => !c.extrapolated && !c.lossNotModelled);
    const pool = inFit.length ? inFit : result.candidates;
    expect(result.candidates[0]!.volume).toBe(Math.min(...pool.map((c) => c.volume)));
  });
});

describe('data it can trust', () => {
  const labels = Object.keys(EXAMPLE_SPECS) as (keyof typeof EXAMPLE_SPECS)[];
  it.each(RANK_BY.flatMap((rankBy) => labels.map((label) => [label, rankBy] as const)))(
    '%s ranked by %s: no extrapolated candidate ranks above an in-fit one',
    (label, rankBy) => {
      const ranked = search(EXAMPLE_SPECS[label], { ...everything, rankBy }).candidates;
      const incomplete = (c: (typeof ranked)[number]) => c.extrapolated || c.lossNotModelled;
      const firstIncomplete = ranked.findIndex(incomplete);
      if (firstIncomplete >= 0) expect(ranked.slice(firstIncomplete).every(incomplete)).toBe(true);
      expect(ranked.map((c) => c.rank)).toEqual(ranked.map((_, i) => i + 1));
    },
  );

  it('E: foil beside a gap, whose edge loss the engine does not model, follows every fully modelled part', () => {
    const ranked = search(EXAMPLE_SPECS.E, everything).candidates;
    const foilBesideGap = ranked.filter((c) => c.lossNotModelled);
    expect(foilBesideGap.length).toBeGreaterThan(0);
    expect(foilBesideGap.every((c) => c.wire.kind === 'foil' && c.result.issues.some((i) => i.code === 'foil-beside-gap'))).toBe(true);
    expect(ranked[0]!.lossNotModelled).toBe(false);
  });

  it('F: where every part rests on extrapolated loss data, foil beside a gap still follows every fully modelled one', () => {
    // Before: #1–#3 were 1 mm foil on P9/5 beside a 0.08 mm gap, ahead of extrapolated round-wire parts, though a
    // missing loss term (the gap field at the foil's edge) is a worse doubt than a fit used outside its range.
    const ranked = search(EXAMPLE_SPECS.F, everything).candidates;
    const firstNotModelled = ranked.findIndex((c) => c.lossNotModelled);
    expect(firstNotModelled).toBeGreaterThan(0);
    expect(ranked.slice(firstNotModelled).every((c) => c.lossNotModelled)).toBe(true);
  });

  it('F: a material fitted at the switching frequency outranks one extrapolated from 300 kHz, though it loses more', () => {
    // Before: #1 used a material fitted at 50–300 kHz, at 2 MHz.
    const fittedAtMegahertz: CoreMaterial = {
      ...materials[0]!,
      id: 'mhz-ferrite',
      name: 'MHz ferrite (invented)',
      k: materials[0]!.k * 3,
      fitFrequencyMin: 1e6,
      fitFrequencyMax: 3e6,
      fitFluxMin: 0.002,
      fitFluxMax: 0.1,
    };
    const result = searchCandidates({ spec: EXAMPLE_SPECS.F, cores, materials: [...materials, fittedAtMegahertz], wires, rankBy: 'loss' });
    expect(result.candidates[0]!.result.material.id).toBe('mhz-ferrite');
    expect(result.candidates[0]!.extrapolated).toBe(false);
    expect(result.counts.extrapolated).toBeGreaterThan(0);
  });

  it('pairs ferrite ring sizes with ferrite and powder toroids with powder only', () => {
    const ring = cores.find((c) => c.family === 'RING')!;
    const toroid = cores.find((c) => c.family === 'POWDER_TOROID')!;
    const ferrite = materials.find((m) => m.family === 'ferrite')!;
    const powder = materials.find((m) => m.family === 'powder')!;
    expect([compatible(ring, ferrite), compatible(ring, powder), compatible(toroid, powder), compatible(toroid, ferrite)]).toEqual([
      true,
      false,
      true,
      false,
    ]);
  });
});

describe('the search space', () => {
  it('A on P9/5: sweeps turns past the flux minimum and finds the lower loss', () => {
    // Before: 4 turns (the flux minimum) at 0.0183 W while 8 turns lose 0.0059 W.
    const p9 = cores.filter((c) => c.id === 'P9/5');
    const result = searchCandidates({ spec: EXAMPLE_SPECS.A, cores: p9, materials, wires, rankBy: 'loss' });
    const best = result.candidates[0]!;
    const minimumTurns = designMagnetics(
      p9[0]!,
      materials.find((m) => m.id === best.result.material.id)!,
      prepareSpec(EXAMPLE_SPECS.A),
    ).turns;
    expect(best.result.turns).toBeGreaterThan(minimumTurns);
    expect(best.result.totalLoss).toBeLessThan(0.01);
  });

  it('more turns never raise the peak flux of a gapped core (B = L·I/(N·Ae), common practice, no source)', () => {
    const ctx = prepareSpec(EXAMPLE_SPECS.C);
    const material = materials.find((m) => m.family === 'ferrite')!;
    const wire = prepareWire(
      wires.find((w) => w.id === 'AWG 20 ×1 G2')!,
      ctx,
    );
    const figures = new CandidateFigures();
    for (const core of cores.filter((c) => c.gapKind === 'air-gap')) {
      let previous = Number.POSITIVE_INFINITY;
      const first = designMagnetics(core, material, ctx).turns;
      for (let turns = first; turns < first + 12; turns++) {
        evaluateCandidate(
          ctx,
          prepareCore(core),
          prepareMaterial(material, ctx),
          designMagnetics(core, material, ctx, turns),
          wire,
          figures,
        );
        expect(figures.fluxPeak).toBeLessThanOrEqual(previous * (1 + 1e-12));
        previous = figures.fluxPeak;
      }
    }
  });

  it('B: litz is not proposed where solid wire does as well', () => {
    // Before: litz 200 × 0.10 mm ranked first at 8.6 % ripple.
    const top = search(EXAMPLE_SPECS.B, { rankBy: 'loss', limit: 10 }).candidates;
    expect(top.filter((c) => c.conductor === 'litz')).toEqual([]);
  });

  it('C: the lowest loss does not fall as the load rises', () => {
    // Before: 9.45 A → 0.416 W, 9.50 A → 0.401 W (the wire set jumped).
    let previous = 0;
    for (let load = 9.0; load <= 10.0 + 1e-9; load += 0.05) {
      const best = search({ ...EXAMPLE_SPECS.C, ioutMax: load }, { rankBy: 'loss', limit: 1 }).candidates[0]!;
      expect(best.result.totalLoss).toBeGreaterThanOrEqual(previous * 0.99);
      previous = best.result.totalLoss;
    }
  });

  it('E: one or two turns at 60 A are proposed in foil too, after the parts whose every loss is modelled', () => {
    // Before: one turn of six 1.8 mm wires beside a 0.73 mm gap. Foil beside a gap carries an edge loss the engine
    // does not model (the field check shows it: +302 % AC resistance on a 17-layer foil design), so it follows.
    const all = search(EXAMPLE_SPECS.E, { ...everything, rankBy: 'loss' }).candidates;
    const foil = all.filter((c) => c.conductor === 'foil');
    expect(foil.length).toBeGreaterThan(0);
    expect(Math.min(...foil.map((c) => c.rank))).toBeGreaterThan(
      Math.max(...all.filter((c) => !c.lossNotModelled && !c.extrapolated).map((c) => c.rank)),
    );
  });
});

describe('paging and fronts', () => {
  it('pages through every candidate and draws both whole Pareto fronts', () => {
    const first = search(EXAMPLE_SPECS.C, { limit: 10 });
    const second = search(EXAMPLE_SPECS.C, { offset: 10, limit: 10 });
    expect(first.page.total).toBe(first.counts.feasible);
    expect(second.candidates.map((c) => c.rank)).toEqual(Array.from({ length: 10 }, (_, i) => 11 + i));
    for (const front of [first.paretoFront, first.paretoFrontByMass]) {
      const size = front === first.paretoFront ? (c: (typeof front)[number]) => c.volume : (c: (typeof front)[number]) => c.mass;
      for (let i = 1; i < front.length; i++) {
        expect(size(front[i]!)).toBeGreaterThanOrEqual(size(front[i - 1]!));
        expect(front[i]!.result.totalLoss).toBeLessThan(front[i - 1]!.result.totalLoss);
      }
    }
  });
});

describe('the loss floor that leaves builds unsolved', () => {
  // A build is left unsolved only when a bound on its loss (copper at ambient, no gap-field loss, the core at its
  // material's lowest temperature factor) shows it can change no result. The search must then answer exactly as if it
  // had solved every build: same ranks, figures, fronts and explanations (the counts of solved builds aside).
  const comparable = (result: SearchResult) => ({ ...result, counts: { ...result.counts, evaluated: 0, screened: 0 } });
  for (const name of Object.keys(EXAMPLE_SPECS) as (keyof typeof EXAMPLE_SPECS)[]) {
    it(`${name}: the same answer as solving every build, with fewer solved`, () => {
      const screened = search(EXAMPLE_SPECS[name], { ...everything, rankBy: 'loss' });
      const solved = search(EXAMPLE_SPECS[name], { ...everything, rankBy: 'loss', solveEveryBuild: true });
      expect(solved.counts.screened).toBe(0);
      expect(screened.counts.screened).toBeGreaterThan(0);
      expect(screened.counts.evaluated + screened.counts.screened).toBe(solved.counts.evaluated);
      expect(comparable(screened)).toEqual(comparable(solved));
    });
  }
});
