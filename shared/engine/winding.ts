import type { CoreShape, WireOption } from './types';

/** Where a winding lies, written by layWinding into a reused object (the search allocates nothing). */
export interface WindingGeometry {
  turnsPerLayer: number;
  layers: number;
  /** Radial build of the winding (m); infinite when not even one turn fits a layer. */
  buildHeight: number;
  meanTurnLength: number;
}

/** Foil leaves this creepage margin at each edge of the winding width (common practice, no source). */
export const FOIL_EDGE_MARGIN = 0.5e-3;

/** Width of a foil winding on this core: the winding width less an edge margin each side (m); 0 on rings. */
export function foilWidth(core: CoreShape): number {
  return core.ring ? 0 : Math.max(0, core.bobbinWidth - 2 * FOIL_EDGE_MARGIN);
}

/** Copper area of one turn (m²); foil takes its width from the core. */
export function conductorCopperArea(wire: WireOption, core?: CoreShape): number {
  if (wire.kind === 'foil') return core ? wire.strandDiameter * foilWidth(core) : 0;
  return (wire.strands * Math.PI * wire.strandDiameter * wire.strandDiameter) / 4;
}

/** Copper fill Ku = N·A_Cu/Wa. */
export function windowFill(turns: number, copperArea: number, windowArea: number): number {
  return (turns * copperArea) / windowArea;
}

/** Mean turn of a ring winding: the section perimeter offset to mid-build, 2·(OD − ID)/2 + 2·h + π·build. */
export function ringMeanTurnLength(ring: { od: number; id: number; height: number }, buildHeight: number): number {
  return ring.od - ring.id + 2 * ring.height + Math.PI * buildHeight;
}

/** Whether the build fits the bobbin (or ring) height; an infinite build never does. */
export function fitsBuildHeight(buildHeight: number, core: CoreShape): boolean {
  return buildHeight <= core.bobbinHeight;
}

/**
 * Layers and turns per layer, without allocating. Bobbin: floor(bobbinWidth/pitch) turns per layer, pitch =
 * conductors·d_o. Ring cores: see layRingWinding.
 */
export function layWinding(turns: number, wire: WireOption, core: CoreShape, out: WindingGeometry): void {
  if (core.ring) {
    if (wire.kind === 'foil') {
      // Foil is not wound on rings.
      out.turnsPerLayer = 0;
      out.layers = Number.POSITIVE_INFINITY;
      out.buildHeight = Number.POSITIVE_INFINITY;
      out.meanTurnLength = core.mlt;
      return;
    }
    layRingWinding(turns, wire, core.ring, core.bobbinHeight, out);
    return;
  }
  if (wire.kind === 'foil') {
    // One turn per layer across the winding width.
    out.turnsPerLayer = foilWidth(core) > 0 ? 1 : 0;
    out.layers = foilWidth(core) > 0 ? turns : Number.POSITIVE_INFINITY;
    out.buildHeight = out.layers * wire.overallDiameter;
    out.meanTurnLength = core.mlt;
    return;
  }
  const perLayer = Math.floor(core.bobbinWidth / (wire.conductorsPerTurn * wire.overallDiameter));
  out.turnsPerLayer = perLayer;
  out.layers = perLayer >= 1 ? Math.ceil(turns / perLayer) : Number.POSITIVE_INFINITY;
  out.buildHeight = out.layers * wire.overallDiameter;
  out.meanTurnLength = core.mlt;
}

/**
 * Ring: layer k (from 1) lies on the circumference π·(ID − (2k − 1)·d_o) and holds floor(that/pitch) turns, so the
 * first layer is floor(π·(ID − d_o)/d_o) for a single conductor; the mean turn grows with the build (taken as the
 * full ring window, `windowBuild`, when the wire does not fit at all).
 */
function layRingWinding(
  turns: number,
  wire: WireOption,
  ring: NonNullable<CoreShape['ring']>,
  windowBuild: number,
  out: WindingGeometry,
): void {
  const pitch = wire.conductorsPerTurn * wire.overallDiameter;
  let placed = 0;
  let layers = 0;
  let first = 0;
  while (placed < turns) {
    const inLayer = Math.floor((Math.PI * (ring.id - (2 * layers + 1) * wire.overallDiameter)) / pitch);
    if (inLayer < 1) {
      layers = Number.POSITIVE_INFINITY;
      break;
    }
    if (layers === 0) first = inLayer;
    placed += inLayer;
    layers += 1;
  }
  out.turnsPerLayer = first;
  out.layers = layers;
  out.buildHeight = layers * wire.overallDiameter;
  out.meanTurnLength = ringMeanTurnLength(ring, Number.isFinite(out.buildHeight) ? out.buildHeight : windowBuild);
}
