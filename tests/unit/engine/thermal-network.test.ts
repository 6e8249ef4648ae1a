import { describe, expect, it } from 'vitest';
import { loadCoreCatalogue } from '../../../core-data/catalogue';
import {
  AirProperties,
  NetworkSolution,
  STEFAN_BOLTZMANN,
  airPrandtlFactor,
  airProperties,
  convectiveConductance,
  exposedArea,
  prandtlFactor,
  radiationFlux,
  radiativeConductance,
  shapedOutline,
  solveNetwork,
  thermalNetwork,
  verticalPlateNusselt,
  type Cooling,
  type NodeSurfaces,
  type ThermalNetwork,
  ConductanceTable,
  nodeConductance,
} from '@shared/engine/thermal-network';
import { coreVolumeThermalResistance, surfaceDissipationRise } from '@shared/engine/thermal';
import type { CoreShape } from '@shared/engine/types';

const only = (over: Partial<NodeSurfaces>): NodeSurfaces => ({
  vertical: 0,
  verticalHeight: 1,
  up: 0,
  upLength: 1,
  down: 0,
  downLength: 1,
  emissivity: 0,
  ...over,
});
/** h (W/(m²·K)) of 1 m² of the given kind at `surface` °C in `ambient` °C air. */
const h = (node: Partial<NodeSurfaces>, surface: number, cooling: Cooling, flowLength = 1) =>
  convectiveConductance(only(node), surface, cooling, flowLength, false, new AirProperties());

const catalogue = loadCoreCatalogue();
const core = (id: string): CoreShape => catalogue.find((c) => c.id === id)!;

describe('air at 1 atm (Sutherland, ideal gas)', () => {
  it('matches Incropera & DeWitt Table A.4 at 300 K and 400 K within 2 % (values from memory)', () => {
    // 300 K: k = 0.0263 W/(m·K), ν = 15.89e-6 m²/s, Pr = 0.707; 400 K: k = 0.0338, ν = 26.41e-6, Pr = 0.690.
    const cases: [number, number, number, number][] = [
      [300, 0.0263, 15.89e-6, 0.707],
      [400, 0.0338, 26.41e-6, 0.69],
    ];
    for (const [kelvin, k, nu, pr] of cases) {
      const air = airProperties(kelvin - 273.15);
      expect(Math.abs(air.conductivity / k - 1)).toBeLessThan(0.02);
      expect(Math.abs(air.viscosity / nu - 1)).toBeLessThan(0.02);
      expect(Math.abs(air.prandtl / pr - 1)).toBeLessThan(0.02);
    }
  });

  it("takes Churchill & Chu's Prandtl function from a parabola within 4e-6 over air's Pr from −40 to 250 °C", () => {
    for (let t = -40; t <= 250; t += 5) {
      const pr = airProperties(t).prandtl;
      expect(pr).toBeGreaterThan(0.66);
      expect(pr).toBeLessThan(0.74);
      expect(Math.abs(airPrandtlFactor(pr) - prandtlFactor(pr))).toBeLessThan(4e-6);
    }
  });
});

describe('convection correlations against worked examples', () => {
  it('vertical plate: Churchill & Chu gives Nu = 147 at Ra = 1.813e9, Pr = 0.690 (Incropera & DeWitt, Example 9.2, fireplace glass door — from memory)', () => {
    expect(Math.abs(verticalPlateNusselt(1.813e9, 0.69) - 147)).toBeLessThan(1);
  });

  it('vertical plate in air: the same door, 0.71 m high at 232 °C in 23 °C air, loses h ≈ 7.0 W/(m²·K) (Incropera & DeWitt, Example 9.2 — from memory)', () => {
    expect(Math.abs(h({ vertical: 1, verticalHeight: 0.71 }, 232, { ambient: 23 }) - 7.0)).toBeLessThan(0.15);
  });

  it('horizontal plates: a 0.75 m wide duct at 45 °C in 15 °C air, L = w/2: top h ≈ 5.47, bottom h ≈ 2.07 W/(m²·K) (Incropera & DeWitt, Example 9.3, 6th ed., McAdams correlations — from memory)', () => {
    expect(Math.abs(h({ up: 1, upLength: 0.375 }, 45, { ambient: 15 }) - 5.47)).toBeLessThan(0.12);
    expect(Math.abs(h({ down: 1, downLength: 0.375 }, 45, { ambient: 15 }) - 2.07)).toBeLessThan(0.05);
  });

  it('forced air: 2 m/s over 30 mm at 300 K gives h = 31.9 W/(m²·K) by hand (Nu = 0.664·Re^½·Pr^⅓ with Incropera Table A.4 air — from memory)', () => {
    // Re = 2·0.03/15.89e-6 = 3776, Nu = 0.664·61.45·0.707^⅓ = 36.35, h = 36.35·0.0263/0.03 = 31.9. An upward face at
    // ambient has no natural convection, so the mixed h is the forced one alone.
    expect(Math.abs(h({ up: 1 }, 26.85, { ambient: 26.85, airSpeed: 2 }, 0.03) - 31.9)).toBeLessThan(0.6);
  });

  it('mixes forced and natural convection as (h_n³ + h_f³)^⅓: more than either alone', () => {
    const natural = h({ vertical: 1, verticalHeight: 0.03 }, 80, { ambient: 40 });
    const forced = h({ up: 1 }, 40, { ambient: 40, airSpeed: 1 }, 0.03);
    const both = h({ vertical: 1, verticalHeight: 0.03 }, 80, { ambient: 40, airSpeed: 1 }, 0.03);
    expect(both).toBeGreaterThan(Math.max(natural, forced));
    expect(both).toBeLessThan(natural + forced);
  });
});

describe('radiation', () => {
  it('is εσ(T⁴ − Ta⁴): ε = 0.9 at 100 °C to 40 °C is 0.9·5.670374e-8·(373.15⁴ − 313.15⁴) = 498.68 W/m² by hand', () => {
    expect(radiationFlux(0.9, 100, 40)).toBeCloseTo(498.68, 1);
    // the conductance form gives the same heat: G·(T − Ta) = εσA(T⁴ − Ta⁴)
    expect(radiativeConductance(2, 0.9, 100, 40) * 60).toBeCloseTo(2 * 498.68, 1);
    expect(STEFAN_BOLTZMANN).toBe(5.670374419e-8);
  });
});

/** Heat one node sheds from its own surfaces at temperature `t` (W). */
function nodeOut(network: ThermalNetwork, n: NodeSurfaces, t: number, cooling: Cooling): number {
  const mounted = cooling.boardThermalResistance !== undefined;
  const convective = convectiveConductance(n, t, cooling, network.flowLength, mounted, new AirProperties());
  return (convective + radiativeConductance(exposedArea(n, mounted), n.emissivity, t, cooling.ambient)) * (t - cooling.ambient);
}

/** Heat leaving the network to ambient at the solution's temperatures (W). */
function heatOut(network: ThermalNetwork, cooling: Cooling, s: NetworkSolution): number {
  const board = cooling.boardThermalResistance !== undefined ? (s.coreTemperature - cooling.ambient) / cooling.boardThermalResistance : 0;
  return (
    nodeOut(network, network.core, s.coreTemperature, cooling) + nodeOut(network, network.winding, s.windingTemperature, cooling) + board
  );
}

function solve(network: ThermalNetwork, cooling: Cooling, coreLoss: number, copperLoss: number): NetworkSolution {
  const s = new NetworkSolution();
  s.coreTemperature = cooling.ambient;
  s.windingTemperature = cooling.ambient;
  return solveNetwork(network, cooling, coreLoss, copperLoss, s, 1e-10, 100);
}

describe('two-node network', () => {
  const etd = thermalNetwork(core('ETD34/17/11'));
  const ring = thermalNetwork(core('R25/15/10'));

  it('balances power in and out to ambient within 1e-6 W (still air, forced air, with a board)', () => {
    const coolings: Cooling[] = [{ ambient: 40 }, { ambient: 25, airSpeed: 1.5 }, { ambient: 40, boardThermalResistance: 30 }];
    for (const network of [etd, ring]) {
      for (const cooling of coolings) {
        const s = solve(network, cooling, 1.2, 2.3);
        expect(s.converged).toBe(true);
        expect(Math.abs(heatOut(network, cooling, s) - 3.5)).toBeLessThan(1e-6);
        // the core–winding link carries what the winding does not shed itself
        const windingOut = nodeOut(network, network.winding, s.windingTemperature, cooling);
        expect(Math.abs(2.3 - windingOut - network.coreToWinding * (s.windingTemperature - s.coreTemperature))).toBeLessThan(1e-6);
      }
    }
  });

  it('cools with forced air and with a board path, and the winding runs hotter than the core when copper dominates', () => {
    const still = solve(etd, { ambient: 40 }, 1, 3);
    const blown = solve(etd, { ambient: 40, airSpeed: 2 }, 1, 3);
    const board = solve(etd, { ambient: 40, boardThermalResistance: 20 }, 1, 3);
    expect(blown.windingTemperature).toBeLessThan(still.windingTemperature - 5);
    expect(board.coreTemperature).toBeLessThan(still.coreTemperature);
    expect(still.windingTemperature).toBeGreaterThan(still.coreTemperature);
  });

  it('splits the surfaces: an E-type set shows its winding at the window openings, a toroid is all winding', () => {
    const c = core('ETD34/17/11');
    const { width, height, depth } = shapedOutline(c);
    const box = 2 * (width * height + height * depth + depth * width);
    // the core's share is the outline box less the openings; the winding adds what stands out of the core's depth
    expect(etd.core.vertical + etd.core.up + etd.core.down).toBeLessThan(box);
    expect(etd.winding.vertical).toBeGreaterThan(0);
    expect(exposedArea(ring.core, false)).toBe(0);
    expect(ring.winding.vertical + ring.winding.up + ring.winding.down).toBeGreaterThan(0);
  });

  it('estimates the outline of a user core (no outline) within 25 % of the catalogue outline', () => {
    const c = core('ETD34/17/11');
    const estimated = shapedOutline({ ...c, outline: undefined });
    expect(Math.abs(estimated.width / c.outline!.width - 1)).toBeLessThan(0.25);
    expect(Math.abs(estimated.height / c.outline!.height - 1)).toBeLessThan(0.25);
  });

  it('gives an ETD49 at 20 W (8 W core, 12 W copper, 40 °C still air) a rise between the two empirical laws', () => {
    // Figures: network core 109.1 K, winding 112.2 K; surface law 104.9 K; volume law (E-type) 190.5 K.
    const c = core('ETD49/25/16');
    const s = solve(thermalNetwork(c), { ambient: 40 }, 8, 12);
    const rise = Math.max(s.coreTemperature, s.windingTemperature) - 40;
    const bySurface = surfaceDissipationRise(20, c.surfaceArea);
    const byVolume = 20 * coreVolumeThermalResistance(c.ve);
    expect(rise).toBeGreaterThan(bySurface);
    expect(rise).toBeLessThan(byVolume);
    expect(Math.abs(rise / bySurface - 1)).toBeLessThan(0.15);
  });

  it('gives an R25/15/10 ring at 2 W (0.8 W core, 1.2 W copper) a rise within 30 % of the surface law', () => {
    // Figures: network core 48.6 K, winding 48.2 K; surface law 56.6 K (the volume law is not applied to rings).
    const c = core('R25/15/10');
    const s = solve(thermalNetwork(c), { ambient: 40 }, 0.8, 1.2);
    const rise = Math.max(s.coreTemperature, s.windingTemperature) - 40;
    expect(Math.abs(rise / surfaceDissipationRise(2, c.surfaceArea) - 1)).toBeLessThan(0.3);
    // the core sits under the winding: its heat crosses into the winding, so it is the hotter node
    expect(s.coreTemperature).toBeGreaterThan(s.windingTemperature);
  });
});

describe('the conductance table the loss–temperature solve reads', () => {
  // The same correlations, evaluated at 96 points in √θ and interpolated: checked here against evaluating them
  // directly (this file's other tests check the correlations themselves against their published forms).
  const catalogue = loadCoreCatalogue();
  const parts = ['ETD34/17/11', 'RM10', 'T26.9/14.7/11.2'].map((id) => catalogue.find((c) => c.id === id)!);
  const coolings = [{ ambient: 40 }, { ambient: 40, airSpeed: 2 }, { ambient: 25, boardThermalResistance: 10 }, { ambient: 100 }];
  it.each(parts.flatMap((core) => coolings.map((cooling) => [core.id, JSON.stringify(cooling), core, cooling] as const)))(
    '%s, %s: within 3e-4 of the correlations from 1 K to 250 K rise',
    (_, __, core, cooling) => {
      const network = thermalNetwork(core);
      const table = new ConductanceTable(network, cooling);
      const mounted = (cooling.boardThermalResistance ?? 0) > 0;
      const read = { conductance: 0, growth: 0 };
      const direct = { conductance: 0, growth: 0 };
      let worst = 0;
      for (let rise = 1; rise <= 250; rise *= 1.03) {
        for (const which of [0, 1] as const) {
          expect(table.at(rise, which, read)).toBe(true);
          nodeConductance(network, which, cooling.ambient + rise, cooling, mounted, new AirProperties(), direct);
          // A toroid's core node has no surface of its own (conductance 0): nothing to compare there.
          if (direct.conductance === 0) expect(read.conductance).toBe(0);
          else worst = Math.max(worst, Math.abs(read.conductance / direct.conductance - 1), Math.abs(read.growth - direct.growth));
        }
      }
      expect(worst).toBeLessThan(3e-4);
      expect(worst).toBeGreaterThan(0);
      expect(table.serves(cooling)).toBe(true);
      expect(table.serves({ ...cooling, ambient: cooling.ambient + 1 })).toBe(false);
      expect(table.at(300, 0, read)).toBe(false);
    },
  );
});
