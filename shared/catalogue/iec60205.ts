// Effective parameters of a ring core (toroid) of rectangular cross-section by the
// IEC 60205 core-constant method. Sharp edges are assumed, so real cores with edge
// radii and coating have a slightly smaller Ae than this.

/** Nominal ring dimensions in metres. */
export interface RingDimensions {
  outerDiameter: number;
  innerDiameter: number;
  height: number;
}

/** Core constants C1 (m⁻¹), C2 (m⁻³) and the effective parameters they give (m, m², m³). */
export interface RingEffectiveParameters {
  c1: number;
  c2: number;
  le: number;
  ae: number;
  ve: number;
}

export function ringEffectiveParameters(dimensions: RingDimensions): RingEffectiveParameters {
  const { outerDiameter, innerDiameter, height } = dimensions;
  if (!(innerDiameter > 0 && outerDiameter > innerDiameter && height > 0) || !Number.isFinite(outerDiameter + height)) {
    throw new RangeError(
      `Ring dimensions must satisfy 0 < ID < OD and height > 0 (got OD ${outerDiameter} m, ID ${innerDiameter} m, height ${height} m)`,
    );
  }
  const innerRadius = innerDiameter / 2;
  const outerRadius = outerDiameter / 2;
  const logRatio = Math.log(outerRadius / innerRadius);
  const c1 = (2 * Math.PI) / (height * logRatio);
  const c2 = (2 * Math.PI * (1 / innerRadius - 1 / outerRadius)) / (height ** 2 * logRatio ** 3);
  return { c1, c2, le: c1 ** 2 / c2, ae: c1 / c2, ve: c1 ** 3 / c2 ** 2 };
}
