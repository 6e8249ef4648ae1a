// Eddy-current loss that an air gap's fringing field drives in the winding, over and above one-dimensional Dowell.
//
// Field: the gap is a slot of length g in the face of a high-permeability leg with the MMF F across it; the face is
// taken as an infinite plane (its potential ±F/2 off the gap, linear across the gap's mouth), so the field in the
// window is the 2-D half-plane solution — W. A. Roshen, "Fringing field formulas and winding loss due to an air gap",
// IEEE Trans. Magnetics 43(8), 2007 (from memory):
//   Hz = (F/(π·g))·[atan((z + g/2)/x) − atan((z − g/2)/x)],  Hx = (F/(2π·g))·ln[(x² + (z + g/2)²)/(x² + (z − g/2)²)],
// x the distance from the leg face, z along the leg from the gap's mid-plane; far away |H| → F/(π·r).
// Conductor: a round conductor of radius a in a uniform transverse field of peak H0 at angular frequency ω loses per
// unit length P′ = 2π·a·ω·μ0·H0²·Re[j·I1(τa)/(τ·I0(τa))], τ = (1 + j)/δ (the classical eddy-current solution of a
// cylinder in a transverse field, from memory; derived here by Poynting's theorem at the surface). Its low-frequency
// limit is P′ = π·σ·ω²·d⁴·B̂²/128, the squared-field-derivative form of C. R. Sullivan, IEEE Trans. Power Electronics
// 16(1), 2001; its high-frequency limit π·d·H0²/(σ·δ) is the surface-resistance loss of a perfectly shielding cylinder.
// Each conductor takes the field at its centre (the field varies across a conductor close to the gap: see the
// field-solver comparison in tests/unit/solvers/gap-field-loss.test.ts).
//
// Stated approximations: the winding's own field and the fringing field are added in power, not as vectors (the
// cross term is left out); the leg face is a plane (the centre leg's curvature, the window's other walls and the
// shielding of outer conductors by inner ones are ignored); the MMF across a gap is N·I times the gap's share of the
// path reluctance. Spacer gaps: a spacer between the halves opens a gap of its thickness in the centre leg (beside the
// winding's middle, like a ground gap, taking Ao/(Ac + Ao) of the gap MMF) and in the outer legs (across the window,
// beside the winding's outside, taking the rest); both are summed with the same formula at their own distances.
// Distributed-gap (powder) cores have no gap: zero. Foil: not here — the field normal to a foil wider than the skin
// depth is shielded by the foil, which the round-conductor formula cannot describe; foil-gap-loss.ts models it.
//
// Two sums, measured against the field solution (tests/unit/solvers/gap-field-loss.test.ts): gapFieldSum (above, the
// search's: O(conductors), Roshen's Hx² only, no cross term; +8…+273 % on one layer, −53…+21 % on two or three) and
// gapFieldSumInWindow (the method of images in the window with the cross term and the core's own MMF, O(conductors²);
// P26/16 within −12…+7 %, ETD34 within −14…−1 % at 0.5 mm keep-out but −17…−71 % at 1–3 mm). The kernel offers both
// (gapLossScale, gapLossScaleInWindow); evaluateDesign still uses the search's, so that its figures equal the search's.
import { MU0 } from './constants';
import { copperResistivity } from './copper';
import type { HarmonicWeights } from './harmonics';
import { skinDepthForResistivity } from './skin-depth';

/**
 * The gap's field at (x, z) per unit MMF across a gap of length g in a plane high-permeability face: Hx² (normal to
 * the face and to a layer) and |H|² (1/m²); g = 0 is the line source 1/(π·r).
 */
export function fringingFieldNormalSquared(x: number, z: number, gap: number): number {
  if (gap <= 0) {
    const r2 = x * x + z * z;
    return (z * z) / (Math.PI * Math.PI * r2 * r2);
  }
  const h = gap / 2;
  const hx = Math.log((x * x + (z + h) * (z + h)) / (x * x + (z - h) * (z - h))) / (2 * Math.PI * gap);
  return hx * hx;
}

/**
 * Hx² per unit MMF with the window's yokes as mirrors: the gap's slot in the leg face repeats at z = m·H (H the window
 * height, the gap on the mid-plane), the images a high-permeability wall makes (the method of images for the gap's
 * field in a core window: J. Hu and C. R. Sullivan, IEEE Trans. Power Electronics 16(4), 2001, from memory). Summing
 * Roshen's field over the row in closed form (Π (a − j·m·H) ∝ sinh(π·a/H), derived here):
 *   Hx = (F/(2π·g))·ln[(sinh²(πx/H) + sin²(π(z + g/2)/H))/(sinh²(πx/H) + sin²(π(z − g/2)/H))],
 * which tends to Roshen's as H → ∞ and falls as e^(−2πx/H) far from the leg, not as 1/x². The outer leg and the
 * winding's own current are not mirrored. Not used by the engine: compared with the field solution in
 * tests/unit/solvers/gap-field-loss.test.ts.
 */
export function fringingFieldNormalSquaredInWindow(x: number, z: number, gap: number, windowHeight: number): number {
  const k = Math.PI / windowHeight;
  const h = gap / 2;
  const s = Math.sinh(k * x);
  const a = Math.sin(k * (z + h));
  const b = Math.sin(k * (z - h));
  const hx = Math.log((s * s + a * a) / (s * s + b * b)) / (2 * Math.PI * gap);
  return hx * hx;
}

export function fringingFieldSquared(x: number, z: number, gap: number): number {
  if (gap <= 0) return 1 / (Math.PI * Math.PI * (x * x + z * z));
  const h = gap / 2;
  const hz = (Math.atan((z + h) / x) - Math.atan((z - h) / x)) / (Math.PI * gap);
  return hz * hz + fringingFieldNormalSquared(x, z, gap);
}

/** Above this |τa| the asymptotic ratio is used: its first omitted term is below 1e-5 of the value. */
const ASYMPTOTIC_ARGUMENT = 30;

/** Up to this u = a/δ the power series is used: at most ~25 terms, cancelling at most a factor ≈ 6 of precision. */
export const SERIES_ARGUMENT = 4;

/**
 * Re[j·I1(ζ)/(ζ·I0(ζ))] at ζ = (1 + j)·u (u = a/δ): for u ≤ SERIES_ARGUMENT by the power series of I0 and I1/ζ in
 * q = ζ²/4 = j·u²/2 (I0 = Σ q^k/k!², I1/ζ = ½·Σ q^k/(k!·(k + 1)!)), above it I1/I0 by the backward continued fraction
 * I_k/I_{k−1} = 1/(2k/ζ + I_{k+1}/I_k), or its asymptotic series 1 − 1/(2ζ) − 1/(8ζ²) for large |ζ|.
 */
export function transverseLossFunction(u: number): number {
  if (u < 1e-3) return (u * u) / 8;
  if (u <= SERIES_ARGUMENT) return transverseLossSeries(u);
  // ζ = u + j·u
  let rr: number;
  let ri: number;
  if (u * Math.SQRT2 > ASYMPTOTIC_ARGUMENT) {
    // 1/ζ = (1 − j)/(2u), 1/ζ² = −j/(2u²)
    rr = 1 - 1 / (4 * u);
    ri = 1 / (4 * u) + 1 / (16 * u * u);
  } else {
    const terms = Math.ceil(2 * u * Math.SQRT2) + 30;
    rr = 0;
    ri = 0;
    for (let k = terms; k >= 1; k--) {
      // 2k/ζ = 2k(1 − j)/(2u) = (k/u)(1 − j); denominator = 2k/ζ + r
      const dr = k / u + rr;
      const di = -k / u + ri;
      const m = dr * dr + di * di;
      rr = dr / m;
      ri = -di / m;
    }
  }
  // j·ρ/ζ = [(ρr − ρi) + j(ρr + ρi)]/(2u)
  return (rr - ri) / (2 * u);
}

function transverseLossSeries(u: number): number {
  const s = (u * u) / 2;
  // term t_k = q^k/k!², q = j·s: t_k = t_{k−1}·j·s/k²
  let tr = 1;
  let ti = 0;
  let i0r = 1;
  let i0i = 0;
  let ar = 1;
  let ai = 0;
  for (let k = 1; k < 60; k++) {
    const f = s / (k * k);
    const nr = -ti * f;
    ti = tr * f;
    tr = nr;
    i0r += tr;
    i0i += ti;
    ar += tr / (k + 1);
    ai += ti / (k + 1);
    if (Math.abs(tr) + Math.abs(ti) < 1e-17 * (Math.abs(i0r) + Math.abs(i0i))) break;
  }
  // j·(A/2)/I0 with A = Σ t_k/(k + 1): Re = −Im(A/I0)/2
  return -(ai * i0r - ar * i0i) / (2 * (i0r * i0r + i0i * i0i));
}

/**
 * Loss per unit length of a round conductor of diameter d in a uniform transverse field of peak 1 A/m (W/m per
 * (A/m)²): P′ = (4π·a²·ρ/δ²)·Re[j·I1(τa)/(τ·I0(τa))]·… with ω·μ0 = 2ρ/δ².
 */
export function transverseFieldLoss(diameter: number, frequency: number, resistivity: number): number {
  const a = diameter / 2;
  const delta = skinDepthForResistivity(resistivity, frequency);
  const u = a / delta;
  return ((4 * Math.PI * a * a * resistivity) / (delta * delta)) * transverseLossFunction(u);
}

/** The low-frequency limit π·σ·ω²·d⁴·B̂²/128 at H0 = 1 A/m (Sullivan 2001's squared-field-derivative form). */
export function transverseFieldLossLowFrequency(diameter: number, frequency: number, resistivity: number): number {
  const omega = 2 * Math.PI * frequency;
  return (Math.PI * omega * omega * diameter ** 4 * MU0 * MU0) / (128 * resistivity);
}

/**
 * Σ_n (I_n²/2)·P′_n per unit field (W/m per (A/m)² of the whole ripple, A²-weighted) for strands of one diameter at
 * the fundamental frequency f and copper temperature T; multiplied by 2·(N·share)²·Σ L·|h|² it is the ripple's loss.
 */
export function rippleTransverseLoss(diameter: number, frequency: number, temperature: number, weights: HarmonicWeights): number {
  const resistivity = copperResistivity(temperature);
  let sum = 0;
  const count = weights.meanSquare.length;
  for (let n = 1; n <= count; n++) {
    const w = weights.meanSquare[n - 1]!;
    if (w === 0) continue;
    const perField = transverseFieldLoss(diameter, n * frequency, resistivity);
    sum += w * perField;
    // The envelope falls as n⁻⁴ and P′ grows at most as n²: stop once the bound of the next term is negligible.
    if (weights.envelope[n - 1]! * perField < 1e-6 * sum) break;
  }
  return sum;
}

/** Where the winding's conductors lie, for the field sum. */
export interface GapFieldLayout {
  turns: number;
  turnsPerLayer: number;
  layers: number;
  /** Conductors side by side per turn (wires in hand; 1 for litz). */
  conductorsPerTurn: number;
  /** Insulated conductor (or bundle) diameter: the pitch along a layer and between layers (m). */
  overallDiameter: number;
  /** Clearance from the centre-leg face to the first layer's copper (m). */
  keepOut: number;
  /** Turn length at the leg face (m); a layer at distance x from it has 2π·x more. */
  legPerimeter: number;
}

/** The gaps whose fringing field reaches the winding, with the share of the winding MMF across each. */
export interface GapFieldSources {
  /** Gap length in the centre leg at the winding's mid-plane (m); 0 for none. */
  centreGap: number;
  centreShare: number;
  /** Gap in the outer legs (spacer), facing the winding's outside across the window (m); 0 for none. */
  outerGap: number;
  outerShare: number;
  /** Window width from the centre-leg face to the outer leg (m). */
  windowWidth: number;
}

/**
 * Σ over conductors of L·(shareC²·|h_centre|² + shareO²·|h_outer|²) per unit winding MMF (1/m): layers outward from
 * the leg face at keepOut + (k + ½)·d_o, turns along the bobbin centred on the gap's mid-plane, the last layer filled
 * from one end (as the field model lays them). Allocation-free. A layer's M = turnsPerLayer·conductorsPerTurn
 * positions z_j = (j + ½ − M/2)·d_o lie symmetric about the mid-plane, where Hx² is even in z: a position whose
 * mirror is also filled is summed once, twice over.
 */
export function gapFieldSum(layout: GapFieldLayout, sources: GapFieldSources): number {
  const { turns, turnsPerLayer, layers, conductorsPerTurn, overallDiameter: d } = layout;
  if (!(turns >= 1 && turnsPerLayer >= 1 && Number.isFinite(layers))) return 0;
  const centre = sources.centreGap > 0 && sources.centreShare > 0;
  const outer = sources.outerGap > 0 && sources.outerShare > 0;
  if (!centre && !outer) return 0;
  // Hx = ln[(x² + (z + g/2)²)/(x² + (z − g/2)²)]/(2π·g): the squared logarithms are summed, the constants applied once.
  const cc = centre ? (sources.centreShare / (2 * Math.PI * sources.centreGap)) ** 2 : 0;
  const oc = outer ? (sources.outerShare / (2 * Math.PI * sources.outerGap)) ** 2 : 0;
  const full = turnsPerLayer * conductorsPerTurn;
  const z0 = (0.5 - full / 2) * d;
  let sum = 0;
  for (let layer = 0; layer < layers; layer++) {
    const x = layout.keepOut + (layer + 0.5) * d;
    const length = layout.legPerimeter + 2 * Math.PI * x;
    const filled = Math.min(turnsPerLayer, turns - layer * turnsPerLayer) * conductorsPerTurn;
    // Positions [0, single) have no filled mirror; [paired, half) pair with theirs; an odd layer's middle is alone.
    const half = full >> 1;
    const paired = full - filled;
    const single = paired < half ? paired : filled < half ? filled : half;
    const middle = (full & 1) === 1 && half < filled;
    let layerSum = 0;
    if (centre) {
      const h = sources.centreGap / 2;
      const x2 = x * x;
      let s = logSquareSum(x2, h, z0, d, 0, single);
      if (paired < half) s += 2 * logSquareSum(x2, h, z0, d, paired, half);
      if (middle) s += logSquareSum(x2, h, z0, d, half, half + 1);
      layerSum += cc * s;
    }
    const xo = sources.windowWidth - x;
    if (outer && xo > 0) {
      const h = sources.outerGap / 2;
      const x2 = xo * xo;
      let s = logSquareSum(x2, h, z0, d, 0, single);
      if (paired < half) s += 2 * logSquareSum(x2, h, z0, d, paired, half);
      if (middle) s += logSquareSum(x2, h, z0, d, half, half + 1);
      layerSum += oc * s;
    }
    sum += length * layerSum;
  }
  return sum;
}

/**
 * Σ_{from ≤ j < to} ln²[(x² + (z_j + h)²)/(x² + (z_j − h)²)], z_j = z0 + j·d. With A = x² + z² + h² and B = 2·z·h the
 * logarithm is ln[(A + B)/(A − B)] = 2·atanh(B/A); where |B/A| ≤ ATANH_SERIES_LIMIT (conductors away from the gap's
 * mouth, most of them) its odd power series to t⁹ is used instead of the logarithm (relative error below 1e-7).
 */
function logSquareSum(x2: number, h: number, z0: number, d: number, from: number, to: number): number {
  let s = 0;
  const h2 = h * h;
  for (let j = from; j < to; j++) {
    const z = z0 + j * d;
    const a = x2 + z * z + h2;
    const t = (2 * z * h) / a;
    let l: number;
    if (t <= ATANH_SERIES_LIMIT && t >= -ATANH_SERIES_LIMIT) {
      const t2 = t * t;
      l = 2 * t * (1 + t2 * (1 / 3 + t2 * (1 / 5 + t2 * (1 / 7 + t2 / 9))));
    } else l = Math.log((a + 2 * z * h) / (a - 2 * z * h));
    s += l * l;
  }
  return s;
}

/** Up to this |t| the atanh series to t⁹ is within 1e-7 of the logarithm (the next term is t¹⁰/11 of it). */
const ATANH_SERIES_LIMIT = 0.25;

/** The window the image method needs besides the layout and the gaps (m). */
export interface GapFieldWindow {
  /** Window height between the yokes, with a spacer's thickness added when the halves stand apart. */
  height: number;
}

/** Line currents a gap's strip current and the core's wall MMF are split into (both were checked against 64/400). */
const STRIP_POINTS = 12;
const WALL_POINTS = 64;

/**
 * Σ over conductors of L·(|h_gapped|² − |h_ungapped|²) per unit winding MMF (1/m), the whole field with the cross
 * term, by the method of images in the rectangular window: J. Hu and C. R. Sullivan, "Analytical method for
 * generalization of numerically optimized inductor winding shapes", IEEE PESC 1999, and "AC resistance of planar
 * power inductors and the quasidistributed gap technique", IEEE Trans. Power Electronics 16(4), 2001 (from memory):
 * the core's walls are taken as μ → ∞ planes x = 0 (leg face), x = W (outer leg), z = ±H/2 (yokes), so every line
 * current has same-sign images at (±x + 2mW, z + 2nH) and (±x + 2mW, H − z + 2nH). Each row of period 2W is summed
 * in closed form, (Hx − j·Hz) = −j·(I/4W)·cot(π(ζ − ζs)/2W), ζ = x + j·z; rows n = −1…1 are kept (the next are
 * below e^(−2πH/W) ≈ 1e-6 of them once the currents per cell sum to zero).
 * Sources: every conductor of the layout (1/(N·conductorsPerTurn) each), a gap as a strip current −share across its
 * length on its wall (a slot of MMF F in a μ → ∞ face is an unbroken face carrying −F over the slot; Roshen's
 * half-plane field is this strip with its one image), and the MMF the core itself drops, −(1 − shares), spread evenly
 * round the window's walls (a μ finite core's tangential H at its surface; the ungapped core drops all of it). The
 * ungapped reference is the same winding with the whole MMF on the walls, as the field solution's ungapped core.
 * Round legs: the axisymmetric field is the planar one through the substitution ψ = u/√r (the term u/(4r²) that it
 * leaves is dropped, the field varying faster than over 2r): each source's field is scaled by √(r_source/r), r from
 * the leg's axis, the leg's radius being legPerimeter/2π (a rectangular leg takes the same, an approximation).
 * Each conductor takes the field at its centre, unshielded by its neighbours' eddy currents. O(conductors²):
 * the design page's figure, not the search's (gapFieldSum).
 */
export function gapFieldSumInWindow(layout: GapFieldLayout, sources: GapFieldSources, window: GapFieldWindow): number {
  const { turns, turnsPerLayer, layers, conductorsPerTurn, overallDiameter: d } = layout;
  if (!(turns >= 1 && turnsPerLayer >= 1 && Number.isFinite(layers))) return 0;
  const centre = sources.centreGap > 0 && sources.centreShare > 0;
  const outer = sources.outerGap > 0 && sources.outerShare > 0;
  const width = sources.windowWidth;
  const height = window.height;
  if ((!centre && !outer) || !(width > 0 && height > 0)) return 0;
  const full = turnsPerLayer * conductorsPerTurn;
  const z0 = (0.5 - full / 2) * d;
  const xs: number[] = [];
  const zs: number[] = [];
  for (let layer = 0; layer < layers; layer++) {
    const filled = Math.min(turnsPerLayer, turns - layer * turnsPerLayer) * conductorsPerTurn;
    for (let j = 0; j < filled; j++) {
      xs.push(layout.keepOut + (layer + 0.5) * d);
      zs.push(z0 + j * d);
    }
  }
  const count = xs.length;
  const current = 1 / (turns * conductorsPerTurn);
  const radius = layout.legPerimeter / (2 * Math.PI);
  const hx = new Float64Array(3 * count);
  const hz = new Float64Array(3 * count);
  // Fields at every conductor from the conductors (slot 0), the gaps' strips (1) and the walls per unit −MMF (2).
  const add = (slot: number, x: number, z: number, amount: number) => {
    const strength = amount * Math.sqrt(radius + x);
    for (let i = 0; i < count; i++) {
      const [fx, fz] = latticeField(xs[i]!, zs[i]!, x, z, width, height);
      const scale = strength / Math.sqrt(radius + xs[i]!);
      hx[slot * count + i] = hx[slot * count + i]! + fx * scale;
      hz[slot * count + i] = hz[slot * count + i]! + fz * scale;
    }
  };
  for (let k = 0; k < count; k++) add(0, xs[k]!, zs[k]!, current);
  for (const [x, gap, share] of [
    [0, sources.centreGap, centre ? sources.centreShare : 0],
    [width, sources.outerGap, outer ? sources.outerShare : 0],
  ] as const) {
    if (!(share > 0)) continue;
    for (let k = 0; k < STRIP_POINTS; k++) add(1, x, (-0.5 + (k + 0.5) / STRIP_POINTS) * gap, -share / STRIP_POINTS);
  }
  const perimeter = 2 * (width + height);
  for (let k = 0; k < WALL_POINTS; k++) {
    const z = (-0.5 + (k + 0.5) / WALL_POINTS) * height;
    const x = ((k + 0.5) / WALL_POINTS) * width;
    add(2, 0, z, -height / perimeter / WALL_POINTS);
    add(2, width, z, -height / perimeter / WALL_POINTS);
    add(2, x, -height / 2, -width / perimeter / WALL_POINTS);
    add(2, x, height / 2, -width / perimeter / WALL_POINTS);
  }
  const rest = 1 - (centre ? sources.centreShare : 0) - (outer ? sources.outerShare : 0);
  let sum = 0;
  for (let i = 0; i < count; i++) {
    const ux = hx[i]! + hx[2 * count + i]!;
    const uz = hz[i]! + hz[2 * count + i]!;
    const gx = hx[i]! + hx[count + i]! + rest * hx[2 * count + i]!;
    const gz = hz[i]! + hz[count + i]! + rest * hz[2 * count + i]!;
    sum += (layout.legPerimeter + 2 * Math.PI * xs[i]!) * (gx * gx + gz * gz - ux * ux - uz * uz);
  }
  return sum;
}

/**
 * (Hx, Hz) at (x, z) per unit line current at (xs, zs) with all its images in the μ → ∞ window [0, W] × [−H/2, H/2]
 * (rows n = −1…1 of period 2W, see gapFieldSumInWindow); the source's own term is left out at its own centre.
 */
export function latticeField(x: number, z: number, xs: number, zs: number, width: number, height: number): [number, number] {
  const k = Math.PI / (2 * width);
  let fx = 0;
  let fz = 0;
  for (let n = -1; n <= 1; n++) {
    for (const rowZ of [zs + 2 * n * height, height - zs + 2 * n * height]) {
      for (const rowX of [xs, -xs]) {
        // cot(p + jq) = (sin 2p − j·sinh 2q)/(cosh 2q − cos 2p)
        const p = k * (x - rowX);
        const q = k * (z - rowZ);
        if (Math.abs(p) < 1e-12 && Math.abs(q) < 1e-12) continue;
        const den = Math.cosh(2 * q) - Math.cos(2 * p);
        const cr = Math.sin(2 * p) / den;
        const ci = -Math.sinh(2 * q) / den;
        // Hx − j·Hz = −j·cot/(4W)
        fx += ci / (4 * width);
        fz += cr / (4 * width);
      }
    }
  }
  return [fx, fz];
}

/**
 * Share of the winding MMF across the gaps: the gap reluctance (lg/F, F the fringing factor) over the whole path's
 * (plus le/μr of the core).
 */
export function gapMmfShare(equivalentGap: number, fringingFactor: number, pathLength: number, permeability: number): number {
  if (!(equivalentGap > 0)) return 0;
  const gap = equivalentGap / fringingFactor;
  return gap / (gap + pathLength / permeability);
}

/**
 * The gap-field loss of a whole ripple (W): 2·N²·Σ L·|h|²·Σ_n (I_n²/2)·P′_n·strands, where `rippleLoss` is
 * rippleTransverseLoss of the strand and `strands` the strands at each conductor position (litz; 1 for round wire).
 */
export function gapFieldLoss(turns: number, fieldSum: number, rippleLoss: number, strands: number): number {
  return 2 * turns * turns * fieldSum * rippleLoss * strands;
}
