// Estimates of bobbin winding space, mean turn length and wound-part surface for a
// set of core halves, from nominal outline dimensions. Used where no coil-former data
// is at hand; the rules are the ones written down in core-data/SOURCES.md.

/** Centre leg of a core set: round (ETD, PQ, RM, pot) or rectangular (E, EFD). Metres. */
export type CentreLeg = { shape: 'round'; diameter: number } | { shape: 'rect'; width: number; depth: number };

/** Nominal outline of an assembled pair of halves, in metres. The window is one side of the centre leg. */
export interface ShapedCoreOutline {
  windowHeight: number;
  windowWidth: number;
  centreLeg: CentreLeg;
  outlineWidth: number;
  outlineHeight: number;
  outlineDepth: number;
}

export interface BobbinEstimate {
  bobbinWidth: number;
  bobbinHeight: number;
  mlt: number;
  surfaceArea: number;
}

// Coil-former flanges take 2–3 mm of window height on mid-size cores; on small cores the
// flanges are thinner, so the allowance is capped at a fraction of the window height.
export const FLANGE_ALLOWANCE_MAX = 2.5e-3;
export const FLANGE_ALLOWANCE_FRACTION = 0.15;
// Tube wall plus clearance to the outer leg take 1–1.5 mm of window width; capped likewise.
export const WALL_ALLOWANCE_MAX = 1.2e-3;
export const WALL_ALLOWANCE_FRACTION = 0.3;

export function centreLegPerimeter(leg: CentreLeg): number {
  return leg.shape === 'round' ? Math.PI * leg.diameter : 2 * (leg.width + leg.depth);
}

export function estimateBobbin(outline: ShapedCoreOutline): BobbinEstimate {
  const flangeAllowance = Math.min(FLANGE_ALLOWANCE_MAX, FLANGE_ALLOWANCE_FRACTION * outline.windowHeight);
  const wallAllowance = Math.min(WALL_ALLOWANCE_MAX, WALL_ALLOWANCE_FRACTION * outline.windowWidth);
  const bobbinWidth = outline.windowHeight - flangeAllowance;
  const bobbinHeight = outline.windowWidth - wallAllowance;

  // Half the wall allowance is the tube wall; the mean turn runs round the centre leg
  // offset by that wall plus half the build, with rounded corners: P + 2π·offset.
  const tubeWall = wallAllowance / 2;
  const mlt = centreLegPerimeter(outline.centreLeg) + 2 * Math.PI * (tubeWall + bobbinHeight / 2);

  // A full winding stands out of the core at the front and back where the centre leg is
  // exposed; the wound part is taken as the outline box that encloses core and winding.
  const legDepth = outline.centreLeg.shape === 'round' ? outline.centreLeg.diameter : outline.centreLeg.depth;
  const woundDepth = Math.max(outline.outlineDepth, legDepth + 2 * (tubeWall + bobbinHeight));
  const { outlineWidth: width, outlineHeight: height } = outline;
  const surfaceArea = 2 * (width * height + height * woundDepth + woundDepth * width);

  return { bobbinWidth, bobbinHeight, mlt, surfaceArea };
}
