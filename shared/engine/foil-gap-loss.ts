// Eddy-current loss that an air gap's fringing field drives in a copper-foil winding, over and above one-dimensional
// Dowell (dowell.ts, which the foil's own current and the window's uniform field already account for).
//
// Method: the window's field as a Fourier series along the legs with the yokes as boundaries of infinite
// permeability — the axial Fourier-series method of L. Rabins, "Transformer reactance calculations with digital
// computers", AIEE Trans. 75 (1956) (from memory) — taken planar (x from the centre-leg face, z along the leg from
// the gap's mid-plane), with the foil turns as conducting slabs and each harmonic solved exactly across them
// (derived here). With the yokes as mirrors of infinite permeability and the foil spanning the window height, the
// field is even and H-periodic in z (H the window height): A_y = Σ_m a_m(x)·cos(k_m·z), k_m = 2πm/H. Harmonic m = 0 is
// uniform in z: it is Dowell's one-dimensional field (with the gap in the centre leg its zero lies at the outer side,
// a mirror image that leaves Dowell's total unchanged) and carries the turn's net current. Each m ≥ 1 has zero mean
// over a turn, so it carries no net current and its loss adds to Dowell's exactly (the harmonics are orthogonal in z).
//
// Sources: the gap mouth in the leg face, where the tangential field is F/g across the gap (Roshen's linear potential
// across the mouth — W. A. Roshen, IEEE Trans. Magnetics 43(8), 2007, from memory — as gap-field-loss.ts takes it)
// and zero elsewhere on the face: a′_m(0) = μ0·h_m, h_m = (2F/H)·sin(k_m·g/2)/(k_m·g/2). A spacer's outer-leg gap
// is the same on the outer-leg face, with the opposite sign (Ampère round the window: the two gaps' MMFs add).
// Across x, a_m″ = γ²·a_m with γ = k_m in air and γ² = k_m² + jωμ0σ in copper; a_m and a_m′ (μ0·Hz) are continuous.
// The ratio a′/a is carried from the far wall across each region by its Möbius step (the Riccati form of the
// transfer matrix, stable for any thickness and harmonic), then a_m marched back; the loss of each foil is the
// Poynting flux into it, (ω/(4μ0))·[Im(a·a′*)]_left^right with the z-average ½ included. This covers thin foil
// (t ≪ δ: the low-frequency squared-field-integral form J = −jωσ·A with its mean removed, A = μ0·∫Hx dz), thick foil
// (t ≫ δ), and the foil's shielding of the normal field by its own eddy currents (the characteristic length δ²/t),
// the inner turns shielding the outer.
//
// Stated approximations: planar (the leg's curvature is left out; each turn's loss per unit length is taken at its
// own turn length, leg perimeter + 2π·x); the foil spans the whole window height (its edge margins, a few % of it,
// are left out); the core's faces are of infinite permeability with the MMF across the gaps set by the gap's share of
// the path reluctance (gapMmfShare); the gap mouth's field is uniform across it; the foil is a uniform slab (the
// interlayer film is air).
import { MU0 } from './constants';

/** Where a foil winding lies in the window. */
export interface FoilGapLayout {
  /** Foil turns, one per layer. */
  layers: number;
  /** Foil thickness (m). */
  thickness: number;
  /** Layer pitch: foil and interlayer film (m); the film is split evenly either side of the copper. */
  pitch: number;
  /** Clearance from the centre-leg face to the first layer's pitch cell (m): its copper starts half a film later. */
  keepOut: number;
  /** Window width, centre-leg face to outer leg (m), and height, yoke to yoke (m). */
  windowWidth: number;
  windowHeight: number;
  /** Turn length at the leg face (m); a turn at distance x from it has 2π·x more. */
  legPerimeter: number;
}

/** The gaps facing the winding, per unit winding MMF. */
export interface FoilGapSources {
  /** Gap in the centre leg at the mid-plane (m) and its share of the winding MMF; 0 for none. */
  centreGap: number;
  centreShare: number;
  /** Gap in the outer legs (spacer), on the outer-leg face at the mid-plane (m), and its share. */
  outerGap: number;
  outerShare: number;
}

/** Harmonics are summed until one adds less than this part of the sum, past the decay length of the nearest source. */
const MODE_TOLERANCE = 1e-7;
/** At most this many harmonics (k·H/2π); only a gap far below a millimetre beside copper far below one needs more. */
const MAX_MODES = 4000;

// Scratch, grown when a winding has more layers than any before: per interface (2·layers + 2 of them, the leg face
// first) the complex a′/a of the source-at-the-leg solution (u) and of the source-at-the-outer-leg one (v), and a.
let capacity = 0;
let gur = new Float64Array(0);
let gui = new Float64Array(0);
let gvr = new Float64Array(0);
let gvi = new Float64Array(0);
let aur = new Float64Array(0);
let aui = new Float64Array(0);
let avr = new Float64Array(0);
let avi = new Float64Array(0);
let width = new Float64Array(0);

function ensure(interfaces: number): void {
  if (interfaces <= capacity) return;
  capacity = interfaces;
  gur = new Float64Array(interfaces);
  gui = new Float64Array(interfaces);
  gvr = new Float64Array(interfaces);
  gvi = new Float64Array(interfaces);
  aur = new Float64Array(interfaces);
  aui = new Float64Array(interfaces);
  avr = new Float64Array(interfaces);
  avi = new Float64Array(interfaces);
  width = new Float64Array(interfaces);
}

// Per-harmonic constants of the copper and the interlayer film: γ, tanh(γd), sech(γd) (complex, as re/im pairs).
let cgr = 0;
let cgi = 0;
let ctr = 0;
let cti = 0;
let csr = 0;
let csi = 0;

/** tanh and sech of z = x + j·y (x ≥ 0) into ctr/cti, csr/csi, with q = e^(−2x) so no term overflows. */
function tanhSech(x: number, y: number): void {
  const q = Math.exp(-2 * x);
  const c2 = Math.cos(2 * y);
  const s2 = Math.sin(2 * y);
  // w = q·e^(−2jy); tanh = (1 − w)/(1 + w), sech = 2·e^(−x)·e^(−jy)/(1 + w)
  const wr = q * c2;
  const wi = -q * s2;
  const dr = 1 + wr;
  const di = wi;
  const m = dr * dr + di * di;
  const nr = 1 - wr;
  const ni = -wi;
  ctr = (nr * dr + ni * di) / m;
  cti = (ni * dr - nr * di) / m;
  const e = 2 * Math.exp(-x);
  const er = e * Math.cos(y);
  const ei = -e * Math.sin(y);
  csr = (er * dr + ei * di) / m;
  csi = (ei * dr - er * di) / m;
}

/**
 * The gap-field resistance of a foil winding (Ω): the loss the gaps' fringing field drives in it, beyond Dowell's, over
 * the square of the winding's r.m.s. current, for a sinusoidal current at `frequency` in copper of `resistivity`.
 * `turns` sets the MMF (N·I times each gap's share).
 */
export function foilGapResistance(
  layout: FoilGapLayout,
  sources: FoilGapSources,
  turns: number,
  frequency: number,
  resistivity: number,
): number {
  const n = layout.layers;
  const t = layout.thickness;
  const H = layout.windowHeight;
  const W = layout.windowWidth;
  const centre = sources.centreGap > 0 && sources.centreShare > 0;
  const outer = sources.outerGap > 0 && sources.outerShare > 0;
  if (!(n >= 1 && t > 0 && H > 0 && W > 0 && frequency > 0 && resistivity > 0) || (!centre && !outer)) return 0;
  const film = Math.max(0, layout.pitch - t);
  const first = layout.keepOut + film / 2;
  const last = Math.max(first + n * t + (n - 1) * film, 0);
  // Regions left to right: air (leg face to the first foil), then foil, film, foil … foil, then air to the outer leg.
  const regions = 2 * n + 1;
  ensure(regions + 1);
  width[0] = Math.max(0, first);
  for (let i = 0; i < n; i++) {
    width[1 + 2 * i] = t;
    if (i < n - 1) width[2 + 2 * i] = film;
  }
  width[regions - 1] = Math.max(0, W - last);
  const omega = 2 * Math.PI * frequency;
  const beta = (omega * MU0) / resistivity; // ωμ0σ
  // Peak MMF per ampere r.m.s. is √2·N·share; the loss per unit area at 1 A r.m.s. is then the resistance.
  const fc = centre ? Math.SQRT2 * turns * sources.centreShare : 0;
  const fo = outer ? Math.SQRT2 * turns * sources.outerShare : 0;
  // The nearest copper to a source sets how fast the harmonics die away.
  const reach = Math.max(1e-9, Math.min(centre ? first : Number.POSITIVE_INFINITY, outer ? W - last : Number.POSITIVE_INFINITY));
  let total = 0;
  for (let m = 1; m <= MAX_MODES; m++) {
    const k = (2 * Math.PI * m) / H;
    const hc = centre ? ((2 * fc) / H) * sinc((k * sources.centreGap) / 2) : 0;
    const ho = outer ? ((2 * fo) / H) * sinc((k * sources.outerGap) / 2) : 0;
    const term = harmonicLoss(layout, n, k, beta, omega, hc, ho);
    total += term;
    if (k * reach > 3 && !(term > MODE_TOLERANCE * total)) break;
  }
  // Per unit area of face → each turn's length (inside harmonicLoss) times the window height.
  return total * H;
}

const sinc = (u: number) => (u < 1e-8 ? 1 : Math.sin(u) / u);

/**
 * One harmonic's loss per unit window height (W/m at the sources' peak Hz amplitudes hc and ho on the two faces),
 * summed over the turns with each turn's length.
 */
function harmonicLoss(layout: FoilGapLayout, n: number, k: number, beta: number, omega: number, hc: number, ho: number): number {
  const regions = 2 * n + 1;
  // Copper: γ = √(k² + jβ), principal root (Re γ > 0).
  {
    const mod = Math.hypot(k * k, beta);
    cgr = Math.sqrt((mod + k * k) / 2);
    cgi = Math.sqrt((mod - k * k) / 2);
  }
  const gr = cgr;
  const gi = cgi;
  tanhSech(gr * layout.thickness, gi * layout.thickness);
  const tr = ctr;
  const ti = cti;
  const sr = csr;
  const si = csi;
  // Air regions: γ = k, real.
  const film = Math.max(0, layout.pitch - layout.thickness);
  const filmTanh = Math.tanh(k * film);
  const filmSech = 1 / Math.cosh(k * film);
  // u: source at the leg face, a′(W) = 0. Sweep g = a′/a from the outer leg inward.
  if (hc !== 0) {
    gur[regions] = 0;
    gui[regions] = 0;
    for (let r = regions - 1; r >= 0; r--) {
      const conductor = (r & 1) === 1;
      const Rr = gur[r + 1]!;
      const Ri = gui[r + 1]!;
      if (conductor) {
        // g_L = (g_R − γτ)/(1 − g_R·τ/γ)
        const [nr, ni] = [Rr - (gr * tr - gi * ti), Ri - (gr * ti + gi * tr)];
        const [qr, qi] = complexDivide(Rr * tr - Ri * ti, Rr * ti + Ri * tr, gr, gi);
        const [lr, li] = complexDivide(nr, ni, 1 - qr, -qi);
        gur[r] = lr;
        gui[r] = li;
      } else {
        const tau = r === 0 || r === regions - 1 ? Math.tanh(k * width[r]!) : filmTanh;
        // g_L = (g_R − kτ)/(1 − g_R·τ/k)
        const [lr, li] = complexDivide(Rr - k * tau, Ri, 1 - (Rr * tau) / k, -(Ri * tau) / k);
        gur[r] = lr;
        gui[r] = li;
      }
    }
    // a(0) = μ0·hc/g(0), then a marched outward: a_R = a_L·sech(γd)/(1 − τ·g_R/γ).
    const [a0r, a0i] = complexDivide(MU0 * hc, 0, gur[0]!, gui[0]!);
    aur[0] = a0r;
    aui[0] = a0i;
    for (let r = 0; r < regions; r++) {
      const conductor = (r & 1) === 1;
      const Rr = gur[r + 1]!;
      const Ri = gui[r + 1]!;
      let fr: number;
      let fi: number;
      if (conductor) {
        const [qr, qi] = complexDivide(Rr * tr - Ri * ti, Rr * ti + Ri * tr, gr, gi);
        [fr, fi] = complexDivide(sr, si, 1 - qr, -qi);
      } else {
        const d = width[r]!;
        const tau = r === 0 || r === regions - 1 ? Math.tanh(k * d) : filmTanh;
        const sech = r === 0 || r === regions - 1 ? sechReal(k * d) : filmSech;
        [fr, fi] = complexDivide(sech, 0, 1 - (Rr * tau) / k, -(Ri * tau) / k);
      }
      aur[r + 1] = aur[r]! * fr - aui[r]! * fi;
      aui[r + 1] = aur[r]! * fi + aui[r]! * fr;
    }
  } else for (let i = 0; i <= regions; i++) aur[i] = aui[i] = gur[i] = gui[i] = 0;
  // v: source at the outer-leg face, a′(0) = 0. Sweep g = a′/a from the leg face outward: g_R = (g_L + γτ)/(1 + g_L·τ/γ).
  if (ho !== 0) {
    gvr[0] = 0;
    gvi[0] = 0;
    for (let r = 0; r < regions; r++) {
      const conductor = (r & 1) === 1;
      const Lr = gvr[r]!;
      const Li = gvi[r]!;
      if (conductor) {
        const [qr, qi] = complexDivide(Lr * tr - Li * ti, Lr * ti + Li * tr, gr, gi);
        const [rr, ri] = complexDivide(Lr + (gr * tr - gi * ti), Li + (gr * ti + gi * tr), 1 + qr, qi);
        gvr[r + 1] = rr;
        gvi[r + 1] = ri;
      } else {
        const tau = r === 0 || r === regions - 1 ? Math.tanh(k * width[r]!) : filmTanh;
        const [rr, ri] = complexDivide(Lr + k * tau, Li, 1 + (Lr * tau) / k, (Li * tau) / k);
        gvr[r + 1] = rr;
        gvi[r + 1] = ri;
      }
    }
    // a(W) = −μ0·ho/g(W), then a marched inward: a_L = a_R·sech(γd)/(1 + τ·g_L/γ).
    const [awr, awi] = complexDivide(-MU0 * ho, 0, gvr[regions]!, gvi[regions]!);
    avr[regions] = awr;
    avi[regions] = awi;
    for (let r = regions - 1; r >= 0; r--) {
      const conductor = (r & 1) === 1;
      const Lr = gvr[r]!;
      const Li = gvi[r]!;
      let fr: number;
      let fi: number;
      if (conductor) {
        const [qr, qi] = complexDivide(Lr * tr - Li * ti, Lr * ti + Li * tr, gr, gi);
        [fr, fi] = complexDivide(sr, si, 1 + qr, qi);
      } else {
        const d = width[r]!;
        const tau = r === 0 || r === regions - 1 ? Math.tanh(k * d) : filmTanh;
        const sech = r === 0 || r === regions - 1 ? sechReal(k * d) : filmSech;
        [fr, fi] = complexDivide(sech, 0, 1 + (Lr * tau) / k, (Li * tau) / k);
      }
      avr[r] = avr[r + 1]! * fr - avi[r + 1]! * fi;
      avi[r] = avr[r + 1]! * fi + avi[r + 1]! * fr;
    }
  } else for (let i = 0; i <= regions; i++) avr[i] = avi[i] = gvr[i] = gvi[i] = 0;
  // Each foil's loss: the Poynting flux S = (ω/(4μ0))·Im(a·a′*) in at its left face less out at its right.
  let sum = 0;
  let x = width[0]!;
  const flux = (i: number): number => {
    const ar = aur[i]! + avr[i]!;
    const ai = aui[i]! + avi[i]!;
    // a′ = g_u·a_u + g_v·a_v
    const dr = gur[i]! * aur[i]! - gui[i]! * aui[i]! + gvr[i]! * avr[i]! - gvi[i]! * avi[i]!;
    const di = gur[i]! * aui[i]! + gui[i]! * aur[i]! + gvr[i]! * avi[i]! + gvi[i]! * avr[i]!;
    // Im(a·conj(a′)) = ai·dr − ar·di
    return ai * dr - ar * di;
  };
  for (let i = 0; i < n; i++) {
    const left = 1 + 2 * i;
    const length = layout.legPerimeter + 2 * Math.PI * (x + layout.thickness / 2);
    sum += length * (flux(left) - flux(left + 1));
    x += layout.thickness + (i < n - 1 ? film : 0);
  }
  return (omega / (4 * MU0)) * sum;
}

function sechReal(x: number): number {
  return x > 700 ? 0 : 1 / Math.cosh(x);
}

function complexDivide(ar: number, ai: number, br: number, bi: number): [number, number] {
  const m = br * br + bi * bi;
  return [(ar * br + ai * bi) / m, (ai * br - ar * bi) / m];
}

/**
 * The thin-foil, low-frequency limit of foilGapResistance over ω²σ (Ω·S/m·s²): each foil carries J = −jωσ·A of the
 * gaps' own field (no shielding), A = μ0·∫Hx dz with its mean over the turn removed (the m = 0 harmonic), so
 * R = ω²σ·(t·H/4)·Σ_turns L·Σ_m |a_m(x)|²·2 (peak to r.m.s.) with, in air between the two faces,
 *   a_m(x) = −μ0·[h_c·cosh(k(W − x)) + h_o·cosh(k·x)]/(k·sinh(k·W)).
 * It bounds the loss from above for foil thinner than the skin depth and orders keep-outs for the search (kernel.ts).
 */
export function foilGapLowFrequencyScale(layout: FoilGapLayout, sources: FoilGapSources, turns: number): number {
  const n = layout.layers;
  const t = layout.thickness;
  const H = layout.windowHeight;
  const W = layout.windowWidth;
  const centre = sources.centreGap > 0 && sources.centreShare > 0;
  const outer = sources.outerGap > 0 && sources.outerShare > 0;
  if (!(n >= 1 && t > 0 && H > 0 && W > 0) || (!centre && !outer)) return 0;
  const film = Math.max(0, layout.pitch - t);
  const first = layout.keepOut + film / 2 + t / 2;
  const last = first + (n - 1) * layout.pitch;
  const fc = centre ? Math.SQRT2 * turns * sources.centreShare : 0;
  const fo = outer ? Math.SQRT2 * turns * sources.outerShare : 0;
  const reach = Math.max(1e-9, Math.min(centre ? first : Number.POSITIVE_INFINITY, outer ? W - last : Number.POSITIVE_INFINITY));
  let total = 0;
  for (let m = 1; m <= MAX_MODES; m++) {
    const k = (2 * Math.PI * m) / H;
    const hc = centre ? ((2 * fc) / H) * sinc((k * sources.centreGap) / 2) : 0;
    const ho = outer ? ((2 * fo) / H) * sinc((k * sources.outerGap) / 2) : 0;
    // cosh(k(W − x))/sinh(kW) = e^(−kx)·(1 + e^(−2k(W − x)))/(1 − e^(−2kW)), and likewise with x for W − x.
    const e2w = Math.exp(-2 * k * W);
    let term = 0;
    for (let i = 0; i < n; i++) {
      const x = Math.min(first + i * layout.pitch, W);
      const a =
        (hc * Math.exp(-k * x) * (1 + Math.exp(-2 * k * (W - x))) + ho * Math.exp(-k * (W - x)) * (1 + Math.exp(-2 * k * x))) /
        (k * (1 - e2w));
      term += (layout.legPerimeter + 2 * Math.PI * x) * a * a;
    }
    total += term;
    if (k * reach > 3 && !(term > MODE_TOLERANCE * total)) break;
  }
  return ((MU0 * MU0 * t * H) / 4) * total;
}
