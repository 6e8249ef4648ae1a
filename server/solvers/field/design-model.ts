// A design as a 2-D field model, axisymmetric for round-leg cores and planar for E and EFD (planarModel below). The
// axisymmetric model: the core as a body of revolution (revolvedCore: the centre leg a cylinder of the core's Ae, the
// window its height G and width Wa/G, the outer leg of area Ae/(Ac/Ao)), the gap ground into the centre leg or a
// spacer under every leg (the halves then stand apart by the spacer), and every conductor where the engine's layout
// puts it: layers outward from the centre leg, turns along the bobbin width centred on the gap's mid-plane, the last
// layer filled from the bottom. Each wire in hand is its own round conductor of its bare diameter
// carrying an equal share of the turn's current (parallel wires side by side in one layer share it nearly equally —
// an approximation, stated); a foil turn is a rectangle of its thickness across the foil width. The whole height is
// modelled (no symmetry plane), so uneven layers need no special case. Bad geometry is refused here, by field.
import type { CoreShape, GapPlacement, WireOption } from '@shared/engine/types';
import { foilWidth } from '@shared/engine/winding';
import { revolvedCore } from './gapped-core.ts';
import type { Outline, Surface } from './geo-builder.ts';

export interface FieldDesignInput {
  core: Pick<CoreShape, 'id' | 'ae' | 'windowArea' | 'windowHeight' | 'centreToOuterLegAreaRatio' | 'bobbinWidth'>;
  /** Relative permeability of the core (linear). */
  permeability: number;
  /** Ground: the total centre-leg gap; spacer: the spacer thickness, a gap in every leg (m). */
  gap: { placement: GapPlacement; length: number };
  turns: number;
  /** The engine's layout: turns per full layer and layers. */
  winding: { turnsPerLayer: number; layers: number };
  wire: Pick<WireOption, 'kind' | 'strandDiameter' | 'strands' | 'overallDiameter' | 'conductorsPerTurn'>;
  /** Clearance between conductors and core on every side: the bobbin wall (m); default 0.5 mm. */
  clearance?: number;
  /** Mesh refinement (1 = default; 2 halves every element size). */
  refinement?: number;
  /** E and EFD: a planar cross-section through the windows, with the rectangular centre leg's width (m). */
  planar?: { legWidth: number };
}

export class FieldGeometryError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'FieldGeometryError';
  }
}

export interface ModelConductor {
  /** GetDP region number. */
  region: number;
  layer: number;
  turn: number;
  /** Fraction of the winding current this conductor carries. */
  share: number;
  /** Planar model: +1 where a turn goes into the page (left window), −1 where it returns (right window). */
  direction?: 1 | -1;
  outline: Outline;
  /** Bare copper area (m²). */
  area: number;
}

export interface DesignModel {
  surfaces: Surface[];
  conductors: ModelConductor[];
  /** The core's cross-section with a margin (m): what the field picture shows (rMin: planar only, negative). */
  view: { rMin?: number; rMax: number; zMin: number; zMax: number };
  sizeAt(r: number, z: number): number;
  /** Planar: the depth (m) that turns per-metre figures into totals; absent for the body of revolution. */
  planar?: { depth: number };
}

export const DEFAULT_CLEARANCE = 0.5e-3;
/** GetDP region numbers. */
export const REGION = { leg: 1, coreRest: 2, air: 3, axis: 4, boundary: 5, firstConductor: 101 } as const;

const refuse = (field: string, message: string): never => {
  throw new FieldGeometryError(field, message);
};

export function checkFieldDesign(d: FieldDesignInput): void {
  const mm = (x: number) => `${(x * 1e3).toFixed(2)} mm`;
  if (!(Number.isInteger(d.turns) && d.turns >= 1)) refuse('turns', `Turns must be a whole number of at least 1, got ${d.turns}.`);
  if (!(d.permeability >= 1 && Number.isFinite(d.permeability))) refuse('permeability', `Permeability must be at least 1.`);
  if (!(d.gap.length >= 0 && Number.isFinite(d.gap.length))) refuse('gap', `Gap must be zero or positive, got ${d.gap.length}.`);
  if (d.gap.length >= d.core.windowHeight)
    refuse('gap', `Gap ${mm(d.gap.length)} is not smaller than the window height ${mm(d.core.windowHeight)} of ${d.core.id}.`);
  if (d.wire.kind === 'litz') refuse('wire', 'Litz bundles are not modelled by the field check (their strands are too many to mesh).');
  if (!(d.wire.strandDiameter > 0 && d.wire.overallDiameter >= d.wire.strandDiameter))
    refuse('wire', 'The wire needs a positive bare diameter no larger than its overall diameter.');
  const { turnsPerLayer, layers } = d.winding;
  if (!(Number.isInteger(turnsPerLayer) && turnsPerLayer >= 1 && Number.isInteger(layers) && layers >= 1))
    refuse('winding', `The layout needs whole turns per layer and layers of at least 1, got ${turnsPerLayer} and ${layers}.`);
  if (turnsPerLayer * layers < d.turns) refuse('winding', `${layers} layers of ${turnsPerLayer} turns do not hold ${d.turns} turns.`);
  if (d.planar && !(d.planar.legWidth > 0 && Number.isFinite(d.planar.legWidth)))
    refuse('core', `The planar model needs the centre leg's width of ${d.core.id}, got ${d.planar.legWidth}.`);
  const clearance = d.clearance ?? DEFAULT_CLEARANCE;
  const build = layers * d.wire.overallDiameter;
  // One window's width, the same in both models.
  const width = d.core.windowArea / d.core.windowHeight;
  if (build + 2 * clearance > width)
    refuse('winding', `${layers} layers build ${mm(build)}, more than the window width ${mm(width)} less ${mm(clearance)} each side.`);
  const span = d.wire.kind === 'foil' ? foilWidth(d.core as CoreShape) : turnsPerLayer * d.wire.conductorsPerTurn * d.wire.overallDiameter;
  const height = windowHeightOf(d);
  if (!(span > 0) || span + 2 * clearance > height)
    refuse('winding', `A layer spans ${mm(span)}, more than the window height ${mm(height)} less ${mm(clearance)} each side.`);
}

/** Window height of the model: the core's, plus the spacer that holds the halves apart. */
const windowHeightOf = (d: FieldDesignInput) => d.core.windowHeight + (d.gap.placement === 'spacer' ? d.gap.length : 0);

/** The model's surfaces and conductors; checks the design first. */
export function designModel(d: FieldDesignInput, skinDepth: number): DesignModel {
  checkFieldDesign(d);
  if (d.planar) return planarModel(d, d.planar.legWidth, skinDepth);
  const c = revolvedCore(d.core);
  const refinement = d.refinement ?? 1;
  const clearance = d.clearance ?? DEFAULT_CLEARANCE;
  const spacer = d.gap.placement === 'spacer';
  const [R, Wo, Ro] = [c.legRadius, c.windowOuter, c.outerRadius];
  const zw = windowHeightOf(d) / 2;
  const hg = d.gap.length / 2;
  const top = zw + c.plate;
  const box = 4 * Math.max(Ro, top);
  const conductors = layConductors(d, R + clearance, skinDepth, refinement);

  const rect = (r0: number, z0: number, r1: number, z1: number): [number, number][] => [
    [r0, z0],
    [r1, z0],
    [r1, z1],
    [r0, z1],
  ];
  const polygon = (corners: [number, number][]): Outline => ({ kind: 'polygon', corners });
  const surfaces: Surface[] = [];
  // Centre leg: one piece when ungapped.
  if (hg > 0)
    surfaces.push(
      { group: REGION.leg, outline: polygon(rect(0, hg, R, zw)) },
      { group: REGION.leg, outline: polygon(rect(0, -zw, R, -hg)) },
    );
  else surfaces.push({ group: REGION.leg, outline: polygon(rect(0, -zw, R, zw)) });
  const outerGap = spacer && hg > 0;
  surfaces.push(
    {
      group: REGION.coreRest,
      outline: polygon([
        [0, zw],
        [R, zw],
        [Wo, zw],
        [Ro, zw],
        [Ro, top],
        [0, top],
      ]),
    },
    {
      group: REGION.coreRest,
      outline: polygon([
        [0, -top],
        [Ro, -top],
        [Ro, -zw],
        [Wo, -zw],
        [R, -zw],
        [0, -zw],
      ]),
    },
  );
  if (outerGap)
    surfaces.push(
      { group: REGION.coreRest, outline: polygon(rect(Wo, hg, Ro, zw)) },
      { group: REGION.coreRest, outline: polygon(rect(Wo, -zw, Ro, -hg)) },
    );
  else surfaces.push({ group: REGION.coreRest, outline: polygon(rect(Wo, -zw, Ro, zw)) });
  // The window (and the gaps opening into it), with the conductors as holes.
  const window: [number, number][] = [
    ...(hg > 0
      ? ([
          [0, -hg],
          [R, -hg],
        ] as [number, number][])
      : []),
    [R, -zw],
    [Wo, -zw],
    ...(outerGap
      ? ([
          [Wo, -hg],
          [Ro, -hg],
          [Ro, hg],
          [Wo, hg],
        ] as [number, number][])
      : []),
    [Wo, zw],
    [R, zw],
    ...(hg > 0
      ? ([
          [R, hg],
          [0, hg],
        ] as [number, number][])
      : []),
  ];
  surfaces.push({ group: REGION.air, outline: polygon(window), holes: conductors.map((k) => k.outline) });
  for (const k of conductors) surfaces.push({ group: k.region, outline: k.outline });
  const outside: [number, number][] = [
    [0, -box],
    [box, -box],
    [box, box],
    [0, box],
    [0, top],
    [Ro, top],
    [Ro, zw],
    ...(outerGap
      ? ([
          [Ro, hg],
          [Ro, -hg],
        ] as [number, number][])
      : []),
    [Ro, -zw],
    [Ro, -top],
    [0, -top],
  ];
  surfaces.push({ group: REGION.air, outline: polygon(outside) });

  const coarse = Math.min(Wo - R, zw) / (16 * refinement);
  const fine = hg > 0 ? Math.min(hg / 5, coarse) / refinement : coarse;
  const gapCorners: [number, number][] =
    hg > 0
      ? [
          [R, hg],
          [R, -hg],
          [0, hg],
          [0, -hg],
          ...(outerGap
            ? ([
                [Wo, hg],
                [Wo, -hg],
                [Ro, hg],
                [Ro, -hg],
              ] as [number, number][])
            : []),
        ]
      : [];
  return {
    surfaces,
    conductors,
    view: { rMax: 1.1 * Ro, zMin: -1.1 * top, zMax: 1.1 * top },
    sizeAt(r, z) {
      if (Math.abs(r) >= box * 0.999 || Math.abs(z) >= box * 0.999) return box / (8 * refinement);
      return gapCorners.some(([gr, gz]) => Math.abs(gr - r) < 1e-12 && Math.abs(gz - z) < 1e-12) ? fine : coarse;
    },
  };
}

/** The planar cross-section (m): x across the core's width (0 on the centre leg's axis), y along the legs. */
export interface PlanarCore {
  halfLeg: number;
  /** The window's outer edge, where the outer leg starts. */
  windowOuter: number;
  /** The outer leg's outer face. */
  outerEdge: number;
  halfWindow: number;
  yoke: number;
  /** Depth of the section (out of the plane). */
  depth: number;
}

/**
 * The depth is Ae / (centre-leg width), so the centre leg's section is exactly the Ae the engine uses: the gap's
 * reluctance lg/(μ0·Ae) and the leg's mean B are then the engine's own, and the inductance compares like with like
 * (the catalogue's centre_leg_depth_mm differs from it by a few %: Ae is an effective area, not the leg's section).
 * Each outer leg has area Ae/(2·Ac/Ao) over the same depth; each yoke is as thick as an outer leg is wide (it carries
 * that leg's flux at the same density).
 */
export function planarCore(core: FieldDesignInput['core'], legWidth: number): PlanarCore {
  const depth = core.ae / legWidth;
  const outerWidth = core.ae / (2 * (core.centreToOuterLegAreaRatio ?? 1) * depth);
  const windowOuter = legWidth / 2 + core.windowArea / core.windowHeight;
  return {
    halfLeg: legWidth / 2,
    windowOuter,
    outerEdge: windowOuter + outerWidth,
    halfWindow: core.windowHeight / 2,
    yoke: outerWidth,
    depth,
  };
}

/**
 * E and EFD as a planar (x–y) section through both windows: the centre leg, both windows, both outer legs, the yokes
 * and the gap; each turn a go conductor in the left window (+I, into the page) and its return mirrored in the right
 * (−I), both laid by layConductors. End turns outside the core are not in the model.
 */
function planarModel(d: FieldDesignInput, legWidth: number, skinDepth: number): DesignModel {
  const c = planarCore(d.core, legWidth);
  const refinement = d.refinement ?? 1;
  const clearance = d.clearance ?? DEFAULT_CLEARANCE;
  const spacer = d.gap.placement === 'spacer';
  const [L, W, O] = [c.halfLeg, c.windowOuter, c.outerEdge];
  const zw = windowHeightOf(d) / 2;
  const hg = d.gap.length / 2;
  const top = zw + c.yoke;
  const box = 4 * Math.max(O, top);
  const returns = layConductors(d, L + clearance, skinDepth, refinement);
  const mirror = (o: Outline): Outline =>
    o.kind === 'circle'
      ? { ...o, centre: [-o.centre[0], o.centre[1]] }
      : { ...o, corners: o.corners.map(([x, y]) => [-x, y] as [number, number]).reverse() };
  const conductors: ModelConductor[] = [
    ...returns.map((k, i) => ({ ...k, region: REGION.firstConductor + i, outline: mirror(k.outline), direction: 1 as const })),
    ...returns.map((k, i) => ({ ...k, region: REGION.firstConductor + returns.length + i, direction: -1 as const })),
  ];
  const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
  ];
  const polygon = (corners: [number, number][]): Outline => ({ kind: 'polygon', corners });
  const surfaces: Surface[] = [];
  if (hg > 0)
    surfaces.push(
      { group: REGION.leg, outline: polygon(rect(-L, hg, L, zw)) },
      { group: REGION.leg, outline: polygon(rect(-L, -zw, L, -hg)) },
    );
  else surfaces.push({ group: REGION.leg, outline: polygon(rect(-L, -zw, L, zw)) });
  // Yokes: their window-side edges split where legs and windows meet them, so the lines are shared.
  const edge = [-O, -W, -L, L, W, O];
  surfaces.push(
    { group: REGION.coreRest, outline: polygon([...edge.map((x) => [x, zw] as [number, number]), [O, top], [-O, top]]) },
    { group: REGION.coreRest, outline: polygon([[-O, -top], [O, -top], ...[...edge].reverse().map((x) => [x, -zw] as [number, number])]) },
  );
  const outerGap = spacer && hg > 0;
  for (const [x0, x1] of [
    [-O, -W],
    [W, O],
  ] as const) {
    if (outerGap)
      surfaces.push(
        { group: REGION.coreRest, outline: polygon(rect(x0, hg, x1, zw)) },
        { group: REGION.coreRest, outline: polygon(rect(x0, -zw, x1, -hg)) },
      );
    else surfaces.push({ group: REGION.coreRest, outline: polygon(rect(x0, -zw, x1, zw)) });
  }
  // The windows, joined through the centre-leg gap when there is one; conductors as holes.
  const rightWindow = (gapped: boolean): [number, number][] => [
    ...(gapped ? ([[L, -hg]] as [number, number][]) : []),
    [L, -zw],
    [W, -zw],
    ...(outerGap
      ? ([
          [W, -hg],
          [O, -hg],
          [O, hg],
          [W, hg],
        ] as [number, number][])
      : []),
    [W, zw],
    [L, zw],
    ...(gapped ? ([[L, hg]] as [number, number][]) : []),
  ];
  const leftWindow = (gapped: boolean) => rightWindow(gapped).map(([x, y]) => [-x, -y] as [number, number]);
  const holes = conductors.map((k) => k.outline);
  if (hg > 0) surfaces.push({ group: REGION.air, outline: polygon([...rightWindow(true), ...leftWindow(true)]), holes });
  else
    surfaces.push(
      { group: REGION.air, outline: polygon(rightWindow(false)), holes: holes.filter((_, i) => conductors[i]!.direction === -1) },
      { group: REGION.air, outline: polygon(leftWindow(false)), holes: holes.filter((_, i) => conductors[i]!.direction === 1) },
    );
  for (const k of conductors) surfaces.push({ group: k.region, outline: k.outline });
  // The air around the core: the core's outline (through the outer-leg gaps when the spacer opens them) as a hole.
  const side: [number, number][] = [
    [O, -top],
    [O, -zw],
    ...(outerGap
      ? ([
          [O, -hg],
          [O, hg],
        ] as [number, number][])
      : []),
    [O, zw],
    [O, top],
  ];
  const core: [number, number][] = [...side, ...side.map(([x, y]) => [-x, -y] as [number, number])];
  surfaces.push({ group: REGION.air, outline: polygon(rect(-box, -box, box, box)), holes: [polygon(core)] });

  const coarse = Math.min(W - L, zw) / (16 * refinement);
  const fine = hg > 0 ? Math.min(hg / 5, coarse) / refinement : coarse;
  const gapCorners: [number, number][] =
    hg > 0 ? [L, -L, ...(outerGap ? [W, O, -W, -O] : [])].flatMap((x) => [[x, hg] as [number, number], [x, -hg] as [number, number]]) : [];
  return {
    surfaces,
    conductors,
    view: { rMin: -1.1 * O, rMax: 1.1 * O, zMin: -1.1 * top, zMax: 1.1 * top },
    planar: { depth: c.depth },
    sizeAt(x, y) {
      if (Math.abs(x) >= box * 0.999 || Math.abs(y) >= box * 0.999) return box / (8 * refinement);
      return gapCorners.some(([gx, gy]) => Math.abs(gx - x) < 1e-12 && Math.abs(gy - y) < 1e-12) ? fine : coarse;
    },
  };
}

/**
 * Conductors as the engine lays them: layer k at distance inner + k·pitch from the centre leg's axis, turns along z
 * centred on the mid-plane (the axisymmetric model's radius; the planar model's right window, mirrored for the left).
 */
function layConductors(d: FieldDesignInput, inner: number, skinDepth: number, refinement: number): ModelConductor[] {
  const w = d.wire;
  const out: ModelConductor[] = [];
  const perLayer = d.winding.turnsPerLayer;
  if (w.kind === 'foil') {
    const width = foilWidth(d.core as CoreShape);
    const size = Math.min(w.strandDiameter / 3, skinDepth / 3) / refinement;
    for (let turn = 0; turn < d.turns; turn++) {
      const r0 = inner + turn * w.overallDiameter + (w.overallDiameter - w.strandDiameter) / 2;
      const corners: [number, number][] = [
        [r0, -width / 2],
        [r0 + w.strandDiameter, -width / 2],
        [r0 + w.strandDiameter, width / 2],
        [r0, width / 2],
      ];
      out.push({
        region: REGION.firstConductor + turn,
        layer: turn,
        turn,
        share: 1,
        outline: { kind: 'polygon', corners, size },
        area: w.strandDiameter * width,
      });
    }
    return out;
  }
  const inHand = w.conductorsPerTurn;
  const pitch = inHand * w.overallDiameter;
  const z0 = (-perLayer * pitch) / 2;
  const radius = w.strandDiameter / 2;
  // ~40 segments round the rim keep the polygon's copper area within 0.3 % of the circle's; three elements per skin depth.
  const size = Math.min((Math.PI * w.strandDiameter) / 40, skinDepth / 3) / refinement;
  for (let turn = 0; turn < d.turns; turn++) {
    const layer = Math.floor(turn / perLayer);
    const r = inner + (layer + 0.5) * w.overallDiameter;
    for (let k = 0; k < inHand; k++) {
      const z = z0 + (turn % perLayer) * pitch + (k + 0.5) * w.overallDiameter;
      out.push({
        region: REGION.firstConductor + out.length,
        layer,
        turn,
        share: 1 / inHand,
        outline: { kind: 'circle', centre: [r, z], radius, size },
        area: Math.PI * radius * radius,
      });
    }
  }
  return out;
}
