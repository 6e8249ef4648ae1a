import type { WireOption } from './types';

export interface WireChoice {
  /** Strand diameter picked: the largest ≤ 2δ, or the smallest single wire meeting Irms/J if that is thinner. */
  strandDiameter: number;
  strands: number;
  requiredCopperArea: number;
  useLitz: boolean;
  /** The options to evaluate, best guess first. */
  options: WireOption[];
}

function strandArea(diameter: number): number {
  return (Math.PI * diameter * diameter) / 4;
}

function roundDiameters(wires: readonly WireOption[]): number[] {
  const set = new Set<number>();
  for (const w of wires) if (w.kind !== 'litz') set.add(w.strandDiameter);
  return [...set].sort((a, b) => a - b);
}

/** The catalogue's n-in-hand option of this diameter, or one made from its single-wire entry. */
export function roundWireInHand(wires: readonly WireOption[], diameter: number, strands: number): WireOption | undefined {
  const exact = wires.find((w) => w.kind !== 'litz' && w.strandDiameter === diameter && w.strands === strands);
  if (exact) return exact;
  const single =
    wires.find((w) => w.kind !== 'litz' && w.strandDiameter === diameter && w.strands === 1) ??
    wires.find((w) => w.kind !== 'litz' && w.strandDiameter === diameter);
  if (!single) return undefined;
  const overallDiameter = single.overallDiameter;
  const baseId = single.strands === 1 ? single.id : single.id.replace(/\s*×\s*\d+$/, '');
  return { ...single, id: `${baseId} ×${strands}`, strands, conductorsPerTurn: strands, overallDiameter };
}

/**
 * Wire for RMS current Irms at current density J when the ripple's skin depth is δ. Round wire in hand up to
 * `maxStrands`, else litz; neighbouring gauges and one extra strand are proposed too so a search can compare.
 */
export function chooseWire(
  rmsCurrent: number,
  currentDensity: number,
  skinDepth: number,
  wires: readonly WireOption[],
  maxStrands = 8,
): WireChoice {
  const requiredCopperArea = rmsCurrent / currentDensity;
  const diameters = roundDiameters(wires);
  const skinLimit = 2 * skinDepth;
  const bySkin = diameters.filter((d) => d <= skinLimit).at(-1) ?? diameters[0];
  const byArea = diameters.find((d) => strandArea(d) >= requiredCopperArea);
  const chosen = byArea !== undefined && bySkin !== undefined && byArea <= bySkin ? byArea : bySkin;
  const options: WireOption[] = [];
  const add = (w: WireOption | undefined) => {
    if (w && !options.some((o) => o.id === w.id)) options.push(w);
  };
  if (chosen === undefined)
    return { strandDiameter: 0, strands: 0, requiredCopperArea, useLitz: true, options: litzOptions(wires, requiredCopperArea) };

  const strandsFor = (d: number) => Math.max(1, Math.ceil(requiredCopperArea / strandArea(d) - 1e-9));
  const strands = strandsFor(chosen);
  const useLitz = strands > maxStrands;
  if (!useLitz) {
    add(roundWireInHand(wires, chosen, strands));
    if (strands + 1 <= maxStrands) add(roundWireInHand(wires, chosen, strands + 1));
    const index = diameters.indexOf(chosen);
    for (const neighbour of [diameters[index + 1], diameters[index - 1]]) {
      if (neighbour === undefined) continue;
      const n = strandsFor(neighbour);
      if (n <= maxStrands) add(roundWireInHand(wires, neighbour, n));
    }
  }
  if (useLitz || strands > 1) for (const litz of litzOptions(wires, requiredCopperArea)) add(litz);
  if (useLitz) {
    // Without enough litz, accept thicker strands: the thinnest gauge that fits in maxStrands, and the next two.
    const index = diameters.findIndex((d) => strandsFor(d) <= maxStrands);
    for (const d of index >= 0 ? diameters.slice(index, index + 3) : diameters.slice(-1)) {
      add(roundWireInHand(wires, d, Math.min(strandsFor(d), maxStrands)));
    }
  }
  return { strandDiameter: chosen, strands, requiredCopperArea, useLitz, options };
}

/** The two litz bundles with the least copper that still meets the required area. */
function litzOptions(wires: readonly WireOption[], requiredCopperArea: number): WireOption[] {
  return wires
    .filter((w) => w.kind === 'litz' && w.strands * strandArea(w.strandDiameter) >= requiredCopperArea)
    .sort((a, b) => a.strands * strandArea(a.strandDiameter) - b.strands * strandArea(b.strandDiameter))
    .slice(0, 2);
}
