import type { CoreShape, WireOption } from './types';

export interface WindingLayout {
  turnsPerLayer: number;
  layers: number;
  /** Radial build of the winding (m). */
  buildHeight: number;
  /** Copper area over core window area. */
  copperFill: number;
  meanTurnLength: number;
  wireLength: number;
  fitsBuild: boolean;
  /** Why it does not fit, in plain words; absent when it fits. */
  reason?: string;
}

/** Copper area of one turn (m²). */
export function conductorCopperArea(wire: WireOption): number {
  return (wire.strands * Math.PI * wire.strandDiameter * wire.strandDiameter) / 4;
}

/** Pitch of one turn along the layer: conductors laid side by side. */
function turnPitch(wire: WireOption): number {
  return wire.conductorsPerTurn * wire.overallDiameter;
}

/**
 * Ring core: layer k (from 1) lies on the circumference π·(ID − (2k − 1)·d_o) and holds floor(that/pitch) turns,
 * so the first layer is floor(π·(ID − d_o)/d_o) for a single conductor.
 */
function ringLayers(turns: number, innerDiameter: number, wire: WireOption): { first: number; layers: number } {
  const pitch = turnPitch(wire);
  const d = wire.overallDiameter;
  let placed = 0;
  let layers = 0;
  let first = 0;
  while (placed < turns) {
    const circumference = Math.PI * (innerDiameter - (2 * layers + 1) * d);
    const inLayer = Math.floor(circumference / pitch);
    if (inLayer < 1) return { first, layers: Number.POSITIVE_INFINITY };
    if (layers === 0) first = inLayer;
    placed += inLayer;
    layers += 1;
  }
  return { first, layers };
}

/** Mean turn of a ring winding: the section perimeter offset to mid-build, 2·(OD − ID)/2 + 2·h + π·build. */
export function ringMeanTurnLength(ring: { od: number; id: number; height: number }, buildHeight: number): number {
  return ring.od - ring.id + 2 * ring.height + Math.PI * buildHeight;
}

export function windingLayout(turns: number, wire: WireOption, core: CoreShape): WindingLayout {
  const copperFill = (turns * conductorCopperArea(wire)) / core.windowArea;
  let turnsPerLayer: number;
  let layers: number;
  let meanTurnLength = core.mlt;
  if (core.ring) {
    const ring = ringLayers(turns, core.ring.id, wire);
    turnsPerLayer = ring.first;
    layers = ring.layers;
  } else {
    turnsPerLayer = Math.floor(core.bobbinWidth / turnPitch(wire));
    layers = turnsPerLayer >= 1 ? Math.ceil(turns / turnsPerLayer) : Number.POSITIVE_INFINITY;
  }
  const buildHeight = layers * wire.overallDiameter;
  if (core.ring && Number.isFinite(buildHeight)) meanTurnLength = ringMeanTurnLength(core.ring, buildHeight);
  const fitsBuild = Number.isFinite(buildHeight) && buildHeight <= core.bobbinHeight;
  const layout: WindingLayout = {
    turnsPerLayer,
    layers,
    buildHeight,
    copperFill,
    meanTurnLength,
    wireLength: turns * meanTurnLength,
    fitsBuild,
  };
  if (!fitsBuild) {
    layout.reason = Number.isFinite(buildHeight)
      ? `Winding needs ${(buildHeight * 1e3).toFixed(2)} mm build height (${layers} layers), ${core.ring ? 'the ring' : 'the bobbin'} allows ${(core.bobbinHeight * 1e3).toFixed(2)} mm.`
      : `The wire is too thick to lay even one turn per layer on ${core.id}.`;
  }
  return layout;
}
