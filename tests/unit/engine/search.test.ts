import { describe, expect, it } from 'vitest';
import { searchCandidates } from '@shared/engine/search';
import { evaluateDesign } from '@shared/engine/evaluate';
import { e25Like, etd34Like, etd44Like, ferriteA, ferriteB, powderP, powderRing, sectionOneSpec, tinyLike, wireSet } from './fixtures';

const input = {
  spec: sectionOneSpec,
  cores: [tinyLike, e25Like, etd34Like, etd44Like, powderRing],
  materials: [ferriteA, ferriteB, powderP],
  wires: wireSet,
};

describe('searchCandidates', () => {
  const result = searchCandidates(input);

  it('returns feasible candidates, smallest core first by default and by total loss when asked', () => {
    expect(result.candidates.length).toBeGreaterThan(0);
    const volumes = result.candidates.filter((c) => !c.extrapolated).map((c) => c.volume);
    expect([...volumes].sort((a, b) => a - b)).toEqual(volumes);
    const byLoss = searchCandidates({ ...input, rankBy: 'loss' }).candidates.filter((c) => !c.extrapolated);
    const losses = byLoss.map((c) => c.result.totalLoss);
    expect([...losses].sort((a, b) => a - b)).toEqual(losses);
    expect(result.candidates.every((c) => c.result.feasible)).toBe(true);
    expect(result.candidates.map((c) => c.rank)).toEqual(result.candidates.map((_, i) => i + 1));
  });

  it('counts what it evaluated', () => {
    expect(result.counts.prefiltered).toBe(1);
    expect(result.counts.feasible).toBeGreaterThan(0);
    expect(result.counts.evaluated).toBeGreaterThanOrEqual(result.counts.feasible);
    // air-gap cores never take the powder material, the ring never takes a ferrite
    expect(result.counts.incompatible).toBe(3 * 1 + 1 * 2);
  });

  it('reports the prefiltered core with its area product reason', () => {
    const tiny = result.infeasible.find((c) => c.coreId === 'tiny-like');
    expect(tiny?.reasons[0]?.message).toMatch(/^Area product 0\.\d\d cm⁴ < required 0\.\d\d cm⁴\.$/);
  });

  it('gives every infeasible candidate a reason', () => {
    expect(result.infeasible.length).toBeGreaterThan(1);
    for (const entry of result.infeasible) expect(entry.reasons.length).toBeGreaterThan(0);
    expect(result.infeasible.some((c) => c.coreId === 'E25-like')).toBe(true);
  });

  it('marks a non-dominated loss-versus-volume front', () => {
    const all = [...result.candidates, ...result.paretoFront];
    for (const front of result.paretoFront) {
      expect(front.pareto).toBe(true);
      const dominated = all.some(
        (other) =>
          other.result.core.ve <= front.result.core.ve &&
          other.result.totalLoss <= front.result.totalLoss &&
          (other.result.core.ve < front.result.core.ve || other.result.totalLoss < front.result.totalLoss),
      );
      expect(dominated).toBe(false);
    }
    for (const candidate of result.candidates.filter((c) => !c.pareto)) {
      const dominated = result.paretoFront.some(
        (f) => f.result.core.ve <= candidate.result.core.ve && f.result.totalLoss <= candidate.result.totalLoss,
      );
      expect(dominated).toBe(true);
    }
  });

  it('agrees with evaluateDesign for the winner', () => {
    const best = result.candidates[0]!;
    const core = input.cores.find((c) => c.id === best.result.core.id)!;
    const material = input.materials.find((m) => m.id === best.result.material.id)!;
    const direct = evaluateDesign({ spec: sectionOneSpec, core, material, turns: 'auto', gap: 'auto', wire: best.wire });
    expect(direct.totalLoss).toBe(best.result.totalLoss);
    expect(direct.turns).toBe(best.result.turns);
  });

  it('ranks by core volume when asked', () => {
    const byVolume = searchCandidates({ ...input, rankBy: 'smallest' });
    const volumes = byVolume.candidates.map((c) => c.result.core.ve);
    expect([...volumes].sort((a, b) => a - b)).toEqual(volumes);
  });

  it('honours allowed families and materials', () => {
    const only = searchCandidates({ ...input, limits: { allowedFamilies: ['ETD'], allowedMaterials: ['illustrative-ferrite-a'] } });
    expect(only.counts.cores).toBe(2);
    expect(only.candidates.every((c) => c.result.core.family === 'ETD' && c.result.material.id === 'illustrative-ferrite-a')).toBe(true);
  });
});
