// Which conductor to wind a given number of turns with on a given core. For each kind of conductor a winder
// would consider — one solid wire, several wires in hand, copper foil, litz — the option with the least copper
// loss (DC plus Dowell's AC loss of the ripple for the layers it needs, litz strand by strand) that fits the window and the build.
// Copper loss depends on the core and the turns only, so one choice serves every material and gap placement.
import { rippleResistanceWeight } from './copper-loss';
import { windingResistance } from './copper';
import { litzWindingFactor } from './litz';
import type { SpecContext, WireContext } from './kernel';
import { turnCopperArea } from './kernel';
import type { CoreShape, WireOption } from './types';
import { fitsBuildHeight, layWinding, ringMeanTurnLength, type WindingGeometry } from './winding';

/** Simplest first: a candidate of a later kind is kept only when it beats every simpler one clearly. */
export const CONDUCTOR_TYPES = ['solid', 'in-hand', 'foil', 'litz'] as const;
export type ConductorType = (typeof CONDUCTOR_TYPES)[number];

export function conductorType(wire: WireOption): ConductorType {
  if (wire.kind === 'litz') return 'litz';
  if (wire.kind === 'foil') return 'foil';
  return wire.strands > 1 ? 'in-hand' : 'solid';
}

export const conductorTypeIndex = (wire: WireOption): number => CONDUCTOR_TYPES.indexOf(conductorType(wire));

/**
 * Foil is for few-turn, high-current parts: offered only when the copper the current needs at the density target is
 * more than one 1 mm round wire carries, and for at most this many turns (common practice, no source).
 */
export const FOIL_MIN_COPPER_AREA = (Math.PI * 1e-3 * 1e-3) / 4;
export const FOIL_MAX_TURNS = 30;

export class ConductorChooser {
  private readonly typeOf: Int8Array;
  /** Wire indices, thickest copper first, so the DC bound below prunes the thin ones early. */
  private readonly byArea: Int32Array;
  private readonly geometry: WindingGeometry = { turnsPerLayer: 0, layers: 0, buildHeight: 0, meanTurnLength: 0 };
  private readonly cache = new Map<number, Int32Array>();

  constructor(
    private readonly ctx: SpecContext,
    private readonly wires: readonly WireContext[],
  ) {
    this.typeOf = Int8Array.from(wires, (w) => conductorTypeIndex(w.wire));
    const areaOf = (w: WireContext) => (w.wire.kind === 'foil' ? w.wire.strandDiameter : w.copperArea);
    this.byArea = Int32Array.from(wires.map((_, i) => i).sort((a, b) => areaOf(wires[b]!) - areaOf(wires[a]!)));
  }

  /**
   * Index into `wires` of the best option of each conductor type (−1 where none fits), cached per core and turns.
   * `coreKey` identifies the core within this search (its index).
   */
  best(core: CoreShape, coreKey: number, turns: number): Int32Array {
    const key = coreKey * 1_000_003 + turns;
    let found = this.cache.get(key);
    if (!found) {
      found = this.choose(core, turns);
      this.cache.set(key, found);
    }
    return found;
  }

  private choose(core: CoreShape, turns: number): Int32Array {
    const { op, limits } = this.ctx;
    const best = new Int32Array(CONDUCTOR_TYPES.length).fill(-1);
    const bestLoss = new Float64Array(CONDUCTOR_TYPES.length).fill(Number.POSITIVE_INFINITY);
    const copperLimit = limits.windowUtilisation * core.windowArea;
    const dcSquare = op.ioutMax * op.ioutMax;
    const foilWorthwhile = op.rmsCurrent / limits.currentDensity > FOIL_MIN_COPPER_AREA && turns <= FOIL_MAX_TURNS;
    // The DC loss alone, at the shortest possible turn, bounds a wire's loss from below.
    const shortestTurn = core.ring ? ringMeanTurnLength(core.ring, 0) : core.mlt;
    for (const i of this.byArea) {
      const wireCtx = this.wires[i]!;
      const wire = wireCtx.wire;
      if (wire.kind === 'foil' ? !foilWorthwhile : wire.kind !== 'litz' && wire.strands > limits.maxStrands) continue;
      const area = turnCopperArea(wireCtx, core);
      if (!(area > 0) || turns * area > copperLimit) continue;
      const type = this.typeOf[i]!;
      if (windingResistance(turns, shortestTurn, area, 20) * dcSquare >= bestLoss[type]!) continue;
      layWinding(turns, wire, core, this.geometry);
      if (!fitsBuildHeight(this.geometry.buildHeight, core)) continue;
      const ripple =
        wire.kind === 'litz'
          ? wireCtx.sums.skin + wireCtx.litzProximity * litzWindingFactor(turns, core.bobbinWidth)
          : rippleResistanceWeight(wireCtx.sums, this.geometry.layers);
      const loss = windingResistance(turns, this.geometry.meanTurnLength, area, 20) * (dcSquare + ripple);
      if (loss < bestLoss[type]!) {
        bestLoss[type] = loss;
        best[type] = i;
      }
    }
    return best;
  }
}
