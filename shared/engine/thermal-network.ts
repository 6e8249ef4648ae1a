// A two-node thermal network of a wound core in still or moving air: node "core" carries the core loss, node
// "winding" the copper loss; a conductance joins them (through the bobbin, or a toroid's insulation) and each node
// loses heat to ambient from its own exposed surfaces by natural convection, radiation and optional forced air; the
// core node may also have a thermal resistance to the board. Temperatures in °C, everything else SI.
//
// Correlations (as given in Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, ch. 7 and 9):
// - vertical plate: Churchill & Chu (1975), all Ra: Nu = {0.825 + 0.387·Ra^(1/6) / [1 + (0.492/Pr)^(9/16)]^(8/27)}²;
// - horizontal plate, hot side facing up: Nu = 0.54·Ra^(1/4) (Ra ≤ 10⁷), 0.15·Ra^(1/3) above (McAdams; Lloyd &
//   Moran 1974), L = area / perimeter; used below its lower range bound Ra = 10⁴ too (small cores), as extrapolation;
// - horizontal plate, hot side facing down: Nu = 0.27·Ra^(1/4) (McAdams), L = area / perimeter;
// - forced air along the part: laminar flat plate, average Nu = 0.664·Re^(1/2)·Pr^(1/3) (Pohlhausen), combined with
//   natural convection as (h_n³ + h_f³)^(1/3) (Churchill's rule for assisting mixed convection, from memory);
// - radiation to surroundings at ambient: εσ(T⁴ − Ta⁴), view factor 1 (surfaces of a part that see each other are
//   not discounted);
// - air at 1 atm and the film temperature: Sutherland's laws for viscosity and conductivity (constants as in White,
//   Viscous Fluid Flow, from memory), ideal gas density, cp = 1007 J/(kg·K), β = 1/T_film.
import type { CoreShape } from './types';

/** Stefan–Boltzmann constant (W/(m²·K⁴)), CODATA 2018. */
export const STEFAN_BOLTZMANN = 5.670374419e-8;
const KELVIN = 273.15;
const GRAVITY = 9.80665;
const AIR_GAS_CONSTANT = 287.05; // J/(kg·K)
const ATMOSPHERE = 101325; // Pa
const AIR_CP = 1007; // J/(kg·K) near 300 K (Incropera Table A.4, from memory)

/**
 * Emissivity of the exposed surfaces: ferrite and coated powder cores ≈ 0.9, enamelled copper or the tape over a
 * winding ≈ 0.9 (from memory; both are dull dielectric or enamel surfaces).
 */
export const CORE_EMISSIVITY = 0.9;
export const WINDING_EMISSIVITY = 0.9;

/**
 * Core-to-winding path of a bobbin-wound part: the bobbin's tube and flanges, wall BOBBIN_WALL thick, of a
 * glass-filled thermoplastic (PBT/PET, about 0.25 W/(m·K), from memory; a 0.5–0.8 mm wall is common practice, no
 * source). Toroids: the wire lies on the core through its coating or tape, taken as INSULATION_LAYER of
 * INSULATION_CONDUCTIVITY over the whole core surface (rough; enamel-to-core contact is along lines, not faces).
 */
export const BOBBIN_WALL = 0.6e-3;
export const BOBBIN_CONDUCTIVITY = 0.25;
export const INSULATION_LAYER = 0.2e-3;
export const INSULATION_CONDUCTIVITY = 0.2;

/**
 * Share of the window openings (front and back) through which a pot core's winding shows: only its two wire slots
 * (a rough figure, no source). Other bobbin-wound families show the whole opening.
 */
export const POT_OPENING_FRACTION = 0.2;

/** Radial build of a toroid's winding for its surfaces: the winding that fills 40 % of the hole (as ring-core.ts). */
const RING_REFERENCE_FILL = 0.4;

/** The exposed surfaces of one node (m²) and their characteristic lengths (m). */
export interface NodeSurfaces {
  /** Vertical faces and the height that sets their boundary layer. */
  vertical: number;
  verticalHeight: number;
  /** Horizontal faces looking up, and their area over perimeter. */
  up: number;
  upLength: number;
  /** Horizontal faces looking down (the part's base; mounted on a board when a board resistance is given). */
  down: number;
  downLength: number;
  emissivity: number;
}

/**
 * The network of one core: what each node exposes and the core–winding conductance (W/K). Orientation: the part
 * stands on its base with the centre-leg axis (a toroid's axis) vertical.
 */
export interface ThermalNetwork {
  core: NodeSurfaces;
  winding: NodeSurfaces;
  coreToWinding: number;
  /** Length of the part along a forced air stream (m). */
  flowLength: number;
}

/** How the part is cooled: ambient (°C), air speed (m/s, 0 = still air), thermal resistance core → board (K/W). */
export interface Cooling {
  ambient: number;
  airSpeed?: number;
  boardThermalResistance?: number;
}

const surfaces = (emissivity: number): NodeSurfaces => ({
  vertical: 0,
  verticalHeight: 1,
  up: 0,
  upLength: 1,
  down: 0,
  downLength: 1,
  emissivity,
});

/** The outline of a shaped set (m): the catalogue's, or estimated from the window, Ae and surface when absent. */
export function shapedOutline(core: CoreShape): { width: number; height: number; depth: number } {
  if (core.outline) return core.outline;
  // User cores: centre leg a square of Ae, outer legs and backs half its width each.
  const leg = Math.sqrt(core.ae);
  const windowWidth = core.windowArea / core.windowHeight;
  const width = 2 * windowWidth + 2 * leg;
  const height = core.windowHeight + leg;
  // Depth from the wound part's box surface 2(WH + HD + DW), at least the leg's.
  const depth = Math.max(leg, (core.surfaceArea / 2 - width * height) / (width + height));
  return { width, height, depth };
}

/**
 * The split of a core's surfaces between the two nodes.
 * - Bobbin-wound sets (E, ETD, EFD, EQ, PQ, RM, POT): the winding shows at the window openings on the front and back
 *   (width 2·window width + centre leg, window height; a pot core only through its slots) and at the sides of the part
 *   that stands out of the core's depth; everything else of the outline box is core: top (up), base (down), the
 *   outer legs' faces and the front and back around the openings (vertical). Core–winding: the bobbin's tube over the
 *   inner turn (MLT − π·build long, bobbin width high) and its two flanges (build × MLT each).
 * - Toroids: the winding covers the core, so every exposed surface is winding (outer rim vertical, the top and base
 *   annuli, the hole's wall left out: it sees mostly itself); the core node reaches ambient only through the winding
 *   (contact over its whole surface) and the board.
 */
export function thermalNetwork(core: CoreShape): ThermalNetwork {
  const coreSide = surfaces(CORE_EMISSIVITY);
  const winding = surfaces(WINDING_EMISSIVITY);
  if (core.ring) {
    const { od, id, height } = core.ring;
    const build = (id / 2) * (1 - Math.sqrt(1 - RING_REFERENCE_FILL));
    const outer = od + 2 * build;
    const inner = Math.max(0, id - 2 * build);
    const woundHeight = height + 2 * build;
    winding.vertical = Math.PI * outer * woundHeight;
    winding.verticalHeight = woundHeight;
    const annulus = (Math.PI / 4) * (outer * outer - inner * inner);
    const annulusLength = (outer - inner) / 4; // area / (π·(outer + inner))
    winding.up = annulus;
    winding.upLength = annulusLength;
    winding.down = annulus;
    winding.downLength = annulusLength;
    const coreSurface = (Math.PI / 2) * (od * od - id * id) + Math.PI * (od + id) * height;
    return {
      core: coreSide,
      winding,
      coreToWinding: (INSULATION_CONDUCTIVITY * coreSurface) / INSULATION_LAYER,
      flowLength: outer,
    };
  }
  const { width, height, depth } = shapedOutline(core);
  const leg = Math.sqrt(core.ae);
  const windowWidth = core.windowArea / core.windowHeight;
  const openingWidth = Math.min(width, 2 * windowWidth + leg);
  const opening = openingWidth * core.windowHeight * (core.family === 'POT' ? POT_OPENING_FRACTION : 1);
  const woundDepth = Math.max(depth, Math.min(depth, leg) + 2 * core.bobbinHeight);
  winding.vertical = 2 * opening + 2 * core.windowHeight * (woundDepth - depth);
  winding.verticalHeight = core.windowHeight;
  coreSide.vertical = 2 * height * depth + 2 * (width * height - opening);
  coreSide.verticalHeight = height;
  const face = width * depth;
  const faceLength = face / (2 * (width + depth));
  coreSide.up = face;
  coreSide.upLength = faceLength;
  coreSide.down = face;
  coreSide.downLength = faceLength;
  const contact = Math.max(0, core.mlt - Math.PI * core.bobbinHeight) * core.bobbinWidth + 2 * core.bobbinHeight * core.mlt;
  return { core: coreSide, winding, coreToWinding: (BOBBIN_CONDUCTIVITY * contact) / BOBBIN_WALL, flowLength: width };
}

/** Air at 1 atm and `film` °C. */
export class AirProperties {
  /** Thermal conductivity (W/(m·K)). */
  conductivity = 0;
  /** Kinematic viscosity (m²/s). */
  viscosity = 0;
  prandtl = 0;
  /** g·β/(ν·α) (1/(K·m³)): Ra = this · ΔT · L³. */
  buoyancy = 0;
}

/** Fills `out` with air's properties at `film` °C (Sutherland's laws, ideal gas). */
export function airProperties(film: number, out: AirProperties = new AirProperties()): AirProperties {
  const t = film + KELVIN;
  const dynamic = (1.716e-5 * (t / 273.15) * Math.sqrt(t / 273.15) * (273.15 + 110.4)) / (t + 110.4);
  const conductivity = (0.0241 * (t / 273.15) * Math.sqrt(t / 273.15) * (273.15 + 194)) / (t + 194);
  const density = ATMOSPHERE / (AIR_GAS_CONSTANT * t);
  const viscosity = dynamic / density;
  const prandtl = (dynamic * AIR_CP) / conductivity;
  out.conductivity = conductivity;
  out.viscosity = viscosity;
  out.prandtl = prandtl;
  out.buoyancy = GRAVITY / t / (viscosity * (viscosity / prandtl));
  return out;
}

/** Churchill & Chu (1975): average Nu of a vertical plate, all Ra. */
export function verticalPlateNusselt(rayleigh: number, prandtl: number): number {
  return churchillChu(rayleigh, prandtlFactor(prandtl));
}

/** [1 + (0.492/Pr)^(9/16)]^(8/27), Churchill & Chu's Prandtl function. */
export function prandtlFactor(prandtl: number): number {
  return Math.pow(1 + Math.pow(0.492 / prandtl, 9 / 16), 8 / 27);
}

// Air's Pr stays within 0.66–0.74 from −40 to 250 °C, where the Prandtl function is smooth: the search takes it from
// the parabola through its values at 0.66, 0.70 and 0.74 (within 4e-6 of it there; see the tests) instead of two
// powers per surface and iteration.
const PR_MID = 0.7;
const PR_STEP = 0.04;
const PR_F0 = prandtlFactor(PR_MID);
const PR_SLOPE = (prandtlFactor(PR_MID + PR_STEP) - prandtlFactor(PR_MID - PR_STEP)) / (2 * PR_STEP);
const PR_CURVE = (prandtlFactor(PR_MID + PR_STEP) - 2 * PR_F0 + prandtlFactor(PR_MID - PR_STEP)) / (PR_STEP * PR_STEP);

/** prandtlFactor by the parabola, for air's range of Pr. */
export function airPrandtlFactor(prandtl: number): number {
  const x = prandtl - PR_MID;
  return PR_F0 + x * (PR_SLOPE + 0.5 * PR_CURVE * x);
}

function churchillChu(rayleigh: number, factor: number): number {
  const root = 0.825 + (0.387 * Math.sqrt(Math.cbrt(rayleigh))) / factor;
  return root * root;
}

/** Hot horizontal plate facing up (McAdams; Lloyd & Moran 1974): 0.54·Ra^¼ up to 10⁷, 0.15·Ra^⅓ above. */
export function upwardPlateNusselt(rayleigh: number): number {
  return rayleigh <= 1e7 ? 0.54 * Math.sqrt(Math.sqrt(rayleigh)) : 0.15 * Math.cbrt(rayleigh);
}

/** Hot horizontal plate facing down (McAdams): 0.27·Ra^¼. */
export function downwardPlateNusselt(rayleigh: number): number {
  return 0.27 * Math.sqrt(Math.sqrt(rayleigh));
}

/** Laminar flat plate in a parallel stream, average Nu = 0.664·Re^½·Pr^⅓. */
export function laminarPlateNusselt(reynolds: number, prandtl: number): number {
  return 0.664 * Math.sqrt(reynolds) * Math.cbrt(prandtl);
}

/** Radiation heat flux (W/m²) of a surface at `surface` °C to surroundings at `ambient` °C. */
export function radiationFlux(emissivity: number, surface: number, ambient: number): number {
  const ts = surface + KELVIN;
  const ta = ambient + KELVIN;
  return emissivity * STEFAN_BOLTZMANN * (ts * ts * ts * ts - ta * ta * ta * ta);
}

const mixed = (natural: number, forced: number) =>
  forced > 0 ? Math.cbrt(natural * natural * natural + forced * forced * forced) : natural;

/**
 * Convective conductance (W/K) from a node at `temperature` to ambient through its surfaces (natural convection, with
 * forced air mixed in). `mounted` leaves the base out (it sits on the board).
 */
export function convectiveConductance(
  node: NodeSurfaces,
  temperature: number,
  cooling: Cooling,
  flowLength: number,
  mounted: boolean,
  air: AirProperties,
): number {
  const ambient = cooling.ambient;
  const rise = temperature > ambient ? temperature - ambient : 0;
  airProperties((temperature + ambient) / 2, air);
  const k = air.conductivity;
  const speed = cooling.airSpeed ?? 0;
  const forced = speed > 0 ? (k / flowLength) * laminarPlateNusselt((speed * flowLength) / air.viscosity, air.prandtl) : 0;
  let g = 0;
  if (node.vertical > 0) {
    const l = node.verticalHeight;
    g += node.vertical * mixed((k / l) * churchillChu(air.buoyancy * rise * l * l * l, airPrandtlFactor(air.prandtl)), forced);
  }
  if (node.up > 0) {
    const l = node.upLength;
    g += node.up * mixed((k / l) * upwardPlateNusselt(air.buoyancy * rise * l * l * l), forced);
  }
  if (!mounted && node.down > 0) {
    const l = node.downLength;
    g += node.down * mixed((k / l) * downwardPlateNusselt(air.buoyancy * rise * l * l * l), forced);
  }
  return g;
}

/** Radiative conductance (W/K) of `area` at `temperature`: ε·σ·(T² + Ta²)(T + Ta)·A, so that G·(T − Ta) = εσA(T⁴ − Ta⁴). */
export function radiativeConductance(area: number, emissivity: number, temperature: number, ambient: number): number {
  const ts = temperature + KELVIN;
  const ta = ambient + KELVIN;
  return emissivity * STEFAN_BOLTZMANN * (ts * ts + ta * ta) * (ts + ta) * area;
}

/** Whether the part sits on a board (a finite board resistance is given), and its conductance to it (W/K). */
export function boardPath(cooling: Cooling): { mounted: boolean; conductance: number } {
  const board = cooling.boardThermalResistance;
  const mounted = board !== undefined && board > 0 && Number.isFinite(board);
  return { mounted, conductance: mounted ? 1 / board : 0 };
}

/** Exposed area of a node (m²): the base is left out when it sits on the board. */
export function exposedArea(node: NodeSurfaces, mounted: boolean): number {
  return node.vertical + node.up + (mounted ? 0 : node.down);
}

/**
 * How strongly a node's conductance grows with its rise, d ln G / d ln θ: ¼ for laminar natural convection
 * (h ∝ ΔT^¼; an upper bound with forced air or the ⅓ law), and θ·d ln h_r/dT for radiation. Used to damp the
 * fixed-point iteration into a Newton-like step.
 */
function riseSensitivity(convective: number, radiative: number, temperature: number, ambient: number): number {
  const total = convective + radiative;
  if (!(total > 0)) return 0;
  const ts = temperature + KELVIN;
  const ta = ambient + KELVIN;
  const theta = temperature > ambient ? temperature - ambient : 0;
  const radiationSlope = theta * ((2 * ts) / (ts * ts + ta * ta) + 1 / (ts + ta));
  return (0.25 * convective + radiationSlope * radiative) / total;
}

/** The network's state: node temperatures (°C) and conductances of the last iteration; reused between solves. */
export class NetworkSolution {
  coreTemperature = 0;
  windingTemperature = 0;
  /** Core → ambient by its surfaces, winding → ambient by its surfaces, core → board (W/K). */
  coreToAmbient = 0;
  windingToAmbient = 0;
  coreToBoard = 0;
  iterations = 0;
  converged = false;
  readonly air = new AirProperties();
  /** Scratch of networkStep. */
  readonly node: NodeConductance = { conductance: 0, growth: 0 };
}

export const NETWORK_TOLERANCE = 0.02;
export const NETWORK_MAX_ITERATIONS = 30;

/**
 * Node temperatures for core loss `coreLoss` and copper loss `copperLoss` (W). The surface conductances depend on the
 * node temperatures, so: evaluate them at the temperatures in `out` (a warm start: the previous solve's, or the
 * caller's guess), solve the linear two-node balance, repeat until neither node moves by more than `tolerance` (K).
 */
export function solveNetwork(
  network: ThermalNetwork,
  cooling: Cooling,
  coreLoss: number,
  copperLoss: number,
  out: NetworkSolution,
  tolerance = NETWORK_TOLERANCE,
  maxIterations = NETWORK_MAX_ITERATIONS,
): NetworkSolution {
  const ambient = cooling.ambient;
  const { mounted, conductance: gBoard } = boardPath(cooling);
  const gcw = network.coreToWinding;
  let tc = out.coreTemperature;
  let tw = out.windingTemperature;
  let iterations = 0;
  let moved = Number.POSITIVE_INFINITY;
  let gc = 0;
  let gw = 0;
  const node = out.node;
  while (iterations < maxIterations && !(moved <= tolerance)) {
    nodeConductance(network, 0, tc, cooling, mounted, out.air, node);
    gc = node.conductance;
    const sc = node.growth;
    nodeConductance(network, 1, tw, cooling, mounted, out.air, node);
    gw = node.conductance;
    const sw = node.growth;
    // (gc + gb + gcw)·θc − gcw·θw = Pc;  −gcw·θc + (gw + gcw)·θw = Pw
    const a = gc + gBoard + gcw;
    const d = gw + gcw;
    const det = a * d - gcw * gcw;
    let nc = ambient + (coreLoss * d + gcw * copperLoss) / det;
    let nw = ambient + (a * copperLoss + gcw * coreLoss) / det;
    // The plain fixed point overshoots by about the sensitivity s of G to θ each time; (θ' + s·θ)/(1 + s) takes
    // a Newton-like step instead (converges in 2–3 iterations from the surface law's guess).
    nc = (nc + sc * tc) / (1 + sc);
    nw = (nw + sw * tw) / (1 + sw);
    moved = Math.max(Math.abs(nc - tc), Math.abs(nw - tw));
    tc = nc;
    tw = nw;
    iterations += 1;
  }
  out.coreTemperature = tc;
  out.windingTemperature = tw;
  out.coreToAmbient = gc;
  out.windingToAmbient = gw;
  out.coreToBoard = gBoard;
  out.iterations = iterations;
  out.converged = moved <= tolerance;
  return out;
}

/**
 * One Newton step of the network with temperature-dependent losses: the node balances
 *   (gc + gb + gcw)·θc − gcw·θw = Pc(Tc),  −gcw·θc + (gw + gcw)·θw = Pw(Tw),
 * linearised at the temperatures in `out` (the conductances' growth with the rise through riseSensitivity, the
 * losses' through their slopes dPc/dTc and dPw/dTw in W/K). Where the losses grow faster than the cooling (no
 * stable point near), the slopes are dropped and the step is the network's at the present losses. The conductances
 * come from `table` where given (made for the same cooling) and it covers the rise. Updates `out`; returns how far the
 * farther node moved (K).
 */
export function networkStep(
  network: ThermalNetwork,
  cooling: Cooling,
  coreLoss: number,
  copperLoss: number,
  coreSlope: number,
  copperSlope: number,
  out: NetworkSolution,
  table?: ConductanceTable,
): number {
  const ambient = cooling.ambient;
  const { mounted, conductance: gBoard } = boardPath(cooling);
  const gcw = network.coreToWinding;
  const tc = out.coreTemperature;
  const tw = out.windingTemperature;
  const thetaC = tc > ambient ? tc - ambient : 0;
  const thetaW = tw > ambient ? tw - ambient : 0;
  const node = out.node;
  if (!table?.at(thetaC, 0, node)) nodeConductance(network, 0, tc, cooling, mounted, out.air, node);
  const gc = node.conductance;
  const growthC = node.growth;
  if (!table?.at(thetaW, 1, node)) nodeConductance(network, 1, tw, cooling, mounted, out.air, node);
  const gw = node.conductance;
  const growthW = node.growth;
  // Residuals of the balances and their Jacobian; d(G·θ)/dθ = G·(1 + d ln G / d ln θ).
  const fc = (gc + gBoard + gcw) * thetaC - gcw * thetaW - coreLoss;
  const fw = (gw + gcw) * thetaW - gcw * thetaC - copperLoss;
  const cooledC = gc * (1 + growthC) + gBoard + gcw;
  const cooledW = gw * (1 + growthW) + gcw;
  let a = cooledC - coreSlope;
  let d = cooledW - copperSlope;
  let det = a * d - gcw * gcw;
  if (!(a > 0 && d > 0 && det > 0)) {
    a = cooledC;
    d = cooledW;
    det = a * d - gcw * gcw;
  }
  const stepC = -(d * fc + gcw * fw) / det;
  const stepW = -(a * fw + gcw * fc) / det;
  const nc = thetaC + stepC > 0 ? tc + stepC : ambient;
  const nw = thetaW + stepW > 0 ? tw + stepW : ambient;
  const moved = Math.max(Math.abs(nc - tc), Math.abs(nw - tw));
  out.coreTemperature = nc;
  out.windingTemperature = nw;
  out.coreToAmbient = gc;
  out.windingToAmbient = gw;
  out.coreToBoard = gBoard;
  out.iterations += 1;
  out.converged = moved <= NETWORK_TOLERANCE;
  return moved;
}

/** A node's conductance to ambient (W/K, convection and radiation) and its growth d ln G / d ln θ. */
export interface NodeConductance {
  conductance: number;
  growth: number;
}

/** Node 0 (core) or 1 (winding) at `temperature` (°C): conductance and growth into `out`. */
export function nodeConductance(
  network: ThermalNetwork,
  which: 0 | 1,
  temperature: number,
  cooling: Cooling,
  mounted: boolean,
  air: AirProperties,
  out: NodeConductance,
): NodeConductance {
  const surfaces = which === 0 ? network.core : network.winding;
  const ambient = cooling.ambient;
  const convective = convectiveConductance(surfaces, temperature, cooling, network.flowLength, mounted, air);
  const radiative = radiativeConductance(exposedArea(surfaces, mounted), surfaces.emissivity, temperature, ambient);
  out.conductance = convective + radiative;
  out.growth = riseSensitivity(convective, radiative, temperature, ambient);
  return out;
}

/** Points of a ConductanceTable, evenly spaced in √θ from 0 to √(TABLE_RISE) K. */
export const TABLE_POINTS = 96;
/** Highest rise a ConductanceTable covers (K); above it networkStep evaluates the correlations. */
export const TABLE_RISE = 260;

/**
 * Each node's conductance and growth against its rise for one core and one cooling, on points evenly spaced in √θ
 * (convection grows as θ^¼, so √θ spacing keeps the points dense where the curve bends), read by linear
 * interpolation: the same correlations evaluated TABLE_POINTS times per node instead of at every step of every solve
 * (within 2e-4 of them, a few hundredths of a kelvin at the rises that matter; see the tests).
 */
export class ConductanceTable {
  readonly ambient: number;
  readonly airSpeed: number;
  readonly board: number;
  private readonly step = Math.sqrt(TABLE_RISE) / (TABLE_POINTS - 1);
  private readonly values = new Float64Array(4 * TABLE_POINTS);

  constructor(network: ThermalNetwork, cooling: Cooling) {
    this.ambient = cooling.ambient;
    this.airSpeed = cooling.airSpeed ?? 0;
    this.board = cooling.boardThermalResistance ?? 0;
    const { mounted } = boardPath(cooling);
    const air = new AirProperties();
    const node: NodeConductance = { conductance: 0, growth: 0 };
    for (let k = 0; k < TABLE_POINTS; k++) {
      const u = k * this.step;
      for (const which of [0, 1] as const) {
        nodeConductance(network, which, cooling.ambient + u * u, cooling, mounted, air, node);
        this.values[4 * k + 2 * which] = node.conductance;
        this.values[4 * k + 2 * which + 1] = node.growth;
      }
    }
  }

  /** Whether this table was made for `cooling`. */
  serves(cooling: Cooling): boolean {
    return (
      this.ambient === cooling.ambient && this.airSpeed === (cooling.airSpeed ?? 0) && this.board === (cooling.boardThermalResistance ?? 0)
    );
  }

  /** Node 0 (core) or 1 (winding) at rise `theta` (K) into `out`; false above the table (the caller evaluates). */
  at(theta: number, which: 0 | 1, out: NodeConductance): boolean {
    const position = Math.sqrt(theta) / this.step;
    const k = Math.floor(position);
    if (!(k < TABLE_POINTS - 1)) return false;
    const f = position - k;
    const i = 4 * k + 2 * which;
    const v = this.values;
    out.conductance = v[i]! + f * (v[i + 4]! - v[i]!);
    out.growth = v[i + 1]! + f * (v[i + 5]! - v[i + 1]!);
    return true;
  }
}
