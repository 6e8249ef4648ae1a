// Dowell's one-dimensional layer model (Proc. IEE 113(8), 1966).
// Fr(Δ, m) = Δ·G_skin(Δ) + (2(m² − 1)/3)·Δ·G_proximity(Δ), split so a harmonic sum can be taken once per
// wire and reused for any layer count.

/** Below this Δ the closed forms lose digits to cancellation; the series is exact to double precision there. */
const SMALL_DELTA = 0.01;
/** Above this Δ the hyperbolic ratios equal 1 to better than 1e-15 (and cosh would overflow far above it). */
const LARGE_DELTA = 20;

/** Δ·(sinh 2Δ + sin 2Δ)/(cosh 2Δ − cos 2Δ): the skin term, → 1 as Δ → 0. */
export function dowellSkinTerm(delta: number): number {
  if (delta < SMALL_DELTA) return 1 + (4 * delta ** 4) / 45;
  if (delta > LARGE_DELTA) return delta;
  const u = 2 * delta;
  return (delta * (Math.sinh(u) + Math.sin(u))) / (Math.cosh(u) - Math.cos(u));
}

/** Δ·(sinh Δ − sin Δ)/(cosh Δ + cos Δ): the proximity term, ≈ Δ⁴/6 for small Δ. */
export function dowellProximityTerm(delta: number): number {
  if (delta < SMALL_DELTA) {
    const d4 = delta ** 4;
    return (d4 / 6) * (1 + d4 * (1 / 840 - 1 / 24));
  }
  if (delta > LARGE_DELTA) return delta;
  return (delta * (Math.sinh(delta) - Math.sin(delta))) / (Math.cosh(delta) + Math.cos(delta));
}

/** Weight of the proximity term for m layers from zero to maximum MMF. */
export function proximityFactor(layers: number): number {
  return (2 * (layers * layers - 1)) / 3;
}

/** Dowell's AC resistance factor Rac/Rdc for m layers at penetration ratio Δ = h/δ. */
export function dowellFactor(delta: number, layers: number): number {
  return dowellSkinTerm(delta) + proximityFactor(layers) * dowellProximityTerm(delta);
}

/** Round wire as an equivalent foil layer: Δ = (π/4)^(3/4)·(d/δ)·√η with porosity η = d/pitch. */
export function roundWireDelta(diameter: number, skinDepth: number, porosity: number): number {
  return Math.pow(Math.PI / 4, 0.75) * (diameter / skinDepth) * Math.sqrt(porosity);
}

/** Foil spanning the winding width: Dowell's layer thickness is the foil's, so Δ = h/δ. */
export function foilDelta(thickness: number, skinDepth: number): number {
  return thickness / skinDepth;
}
