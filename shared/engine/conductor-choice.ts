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
  /** Foil options, thickest first. */
  private readonly foils: Int32Array;
  /** Every other option, most copper first (so the fill check and the DC bound below cut the list short). */
  private readonly rounds: Int32Array;
  private readonly roundAreas: Float64Array;
  /** The conductor types each list holds, one bit each. */
  private readonly foilTypes: number;
  private readonly roundTypes: number;
  private readonly geometry: WindingGeometry = { turnsPerLayer: 0, layers: 0, buildHeight: 0, meanTurnLength: 0 };
  private readonly cache = new Map<number, Int32Array>();

  constructor(
    private readonly ctx: SpecContext,
    private readonly wires: readonly WireContext[],
  ) {
    this.typeOf = Int8Array.from(wires, (w) => conductorTypeIndex(w.wire));
    const indices = wires.map((_, i) => i);
    const isFoil = (i: number) => wires[i]!.wire.kind === 'foil';
    this.foils = Int32Array.from(indices.filter(isFoil).sort((a, b) => wires[b]!.wire.strandDiameter - wires[a]!.wire.strandDiameter));
    this.rounds = Int32Array.from(indices.filter((i) => !isFoil(i)).sort((a, b) => wires[b]!.copperArea - wires[a]!.copperArea));
    this.roundAreas = Float64Array.from(this.rounds, (i) => wires[i]!.copperArea);
    const typesOf = (list: Int32Array) => list.reduce((bits, i) => bits | (1 << this.typeOf[i]!), 0);
    this.foilTypes = typesOf(this.foils);
    this.roundTypes = typesOf(this.rounds);
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
    const { op } = this.ctx;
    const best = new Int32Array(CONDUCTOR_TYPES.length).fill(-1);
    const bestLoss = new Float64Array(CONDUCTOR_TYPES.length).fill(Number.POSITIVE_INFINITY);
    const copperLimit = this.ctx.limits.windowUtilisation * core.windowArea;
    const foilWorthwhile = op.rmsCurrent / this.ctx.limits.currentDensity > FOIL_MIN_COPPER_AREA && turns <= FOIL_MAX_TURNS;
    if (foilWorthwhile) this.consider(this.foils, this.foilTypes, 0, core, turns, best, bestLoss);
    // The options are sorted by copper area: those too thick for the window's copper come first and are skipped.
    let first = 0;
    let last = this.roundAreas.length;
    while (first < last) {
      const mid = (first + last) >> 1;
      if (turns * this.roundAreas[mid]! > copperLimit) first = mid + 1;
      else last = mid;
    }
    this.consider(this.rounds, this.roundTypes, first, core, turns, best, bestLoss);
    return best;
  }

  /**
   * The options of `order` from `from` on (copper area falling within each type), each kept where it loses least of
   * its type. The DC loss alone, at the shortest possible turn, bounds a wire's loss from below and only grows along
   * the list: once it reaches a type's best, no later option of that type can beat it, and the type is done.
   */
  private consider(
    order: Int32Array,
    types: number,
    from: number,
    core: CoreShape,
    turns: number,
    best: Int32Array,
    bestLoss: Float64Array,
  ): void {
    const { op, limits } = this.ctx;
    const copperLimit = limits.windowUtilisation * core.windowArea;
    const dcSquare = op.ioutMax * op.ioutMax;
    const shortestTurn = core.ring ? ringMeanTurnLength(core.ring, 0) : core.mlt;
    let done = 0;
    for (let k = from; k < order.length; k++) {
      const i = order[k]!;
      const type = this.typeOf[i]!;
      if (done & (1 << type)) continue;
      const wireCtx = this.wires[i]!;
      const wire = wireCtx.wire;
      if (wire.kind !== 'foil' && wire.kind !== 'litz' && wire.strands > limits.maxStrands) continue;
      const area = turnCopperArea(wireCtx, core);
      if (!(area > 0) || turns * area > copperLimit) continue;
      if (windingResistance(turns, shortestTurn, area, 20) * dcSquare >= bestLoss[type]!) {
        done |= 1 << type;
        if ((done & types) === types) return;
        continue;
      }
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
  }
}
