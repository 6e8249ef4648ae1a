// The winding drawn: one pure function from the engine's figures to shapes in metres, so the design page, the sheet's
// HTML view and its PDF draw the same picture (drawing-layout.ts fits it to a box; the renderers only paint).
// Coordinates (m, y up): a shaped core lies on its side, the centre leg along x (0 on the mating plane of the halves)
// and the layers stacking up in y from the centre-leg face, as a winding build is drawn; a ring is centred on 0.
import type { EvaluationResult } from '@shared/engine/evaluate';
import { DEFAULT_KEEP_OUT } from '@shared/engine/inputs';
import type { CoreFamily, CoreShape, GapPlacement, WireKind, WireOption } from '@shared/engine/types';
import { FOIL_EDGE_MARGIN } from '@shared/engine/winding';
import { millimetre } from './sheet-text';

/** What the drawing needs, as plain data: frozen with the winding sheet at release (SI units). */
export interface WindingDrawingInput {
  family: CoreFamily;
  turns: number;
  layers: number;
  turnsPerLayer: number;
  wire: { kind: WireKind; strandDiameter: number; overallDiameter: number; conductorsPerTurn: number };
  /** Copper's clearance from the centre-leg face (m); null where there is no air gap or the result predates it. */
  keepOut: number | null;
  /** The air gap: a ground centre-leg gap (`total`) or a spacer under all legs (`spacer` each); null for none. */
  gap: { placement: GapPlacement; total: number; spacer: number } | null;
  core: {
    /** Window from the centre-leg face to the outer leg, and along the leg (m). */
    windowWidth: number;
    windowHeight: number;
    bobbinWidth: number;
    bobbinHeight: number;
    /** Indicative: centre-leg width across the section, outer-leg width, yoke thickness (m). */
    centreLeg: number;
    outerLeg: number;
    yoke: number;
    ring: { od: number; id: number; height: number } | null;
  };
}

const ROUND_LEG_FAMILIES: readonly CoreFamily[] = ['ETD', 'EQ', 'PQ', 'RM', 'POT'];

/**
 * The drawing's input from an evaluated design, its core and its wire. The window comes from the core (width =
 * area / height, as the engine's field model takes it); the legs and yokes, which the engine does not need, are
 * indicative: a round leg of area Ae (or a rectangle of the outline's depth), outer legs and yokes from the outline.
 */
export function windingDrawingInput(result: EvaluationResult, core: CoreShape, wire: WireOption): WindingDrawingInput {
  const windowWidth = core.windowArea / core.windowHeight;
  const centreLeg = ROUND_LEG_FAMILIES.includes(core.family)
    ? Math.sqrt((4 * core.ae) / Math.PI)
    : core.outline
      ? core.ae / core.outline.depth
      : Math.sqrt(core.ae);
  const fromOutline = (total: number | undefined, inner: number) =>
    total !== undefined && total > inner ? (total - inner) / 2 : centreLeg / 2;
  const outerLeg = Math.max(centreLeg / 4, fromOutline(core.outline?.width, 2 * windowWidth + centreLeg));
  const yoke = Math.max(centreLeg / 4, fromOutline(core.outline?.height, core.windowHeight));
  const gapped = core.gapKind === 'air-gap' && result.gap.total > 0;
  return {
    family: core.family,
    turns: result.turns,
    layers: result.winding.layers,
    turnsPerLayer: result.winding.turnsPerLayer,
    wire: {
      kind: wire.kind,
      strandDiameter: wire.strandDiameter,
      overallDiameter: wire.overallDiameter,
      conductorsPerTurn: wire.conductorsPerTurn,
    },
    keepOut: gapped && !core.ring ? (result.winding.keepOut ?? null) : null,
    gap: gapped ? { placement: result.gap.placement, total: result.gap.total, spacer: result.gap.spacer } : null,
    core: {
      windowWidth,
      windowHeight: core.windowHeight,
      bobbinWidth: core.bobbinWidth,
      bobbinHeight: core.bobbinHeight,
      centreLeg,
      outerLeg,
      yoke,
      ring: core.ring ?? null,
    },
  };
}

/** What a shape is, for its colour: the renderers map a role to a theme colour (SVG) or a grey (PDF). */
export type DrawingRole = 'core' | 'gap' | 'bobbin' | 'tape' | 'copper' | 'insulation' | 'keep-out' | 'axis' | 'dimension';

export type DrawingShape =
  | { kind: 'rect'; role: DrawingRole; x: number; y: number; width: number; height: number; hatch?: boolean }
  | { kind: 'circle'; role: DrawingRole; cx: number; cy: number; r: number; turn?: number }
  | { kind: 'annulus'; role: DrawingRole; cx: number; cy: number; r: number; inner: number }
  | { kind: 'line'; role: DrawingRole; x1: number; y1: number; x2: number; y2: number; dashed?: boolean }
  /** A dimension from (x1, y1) to (x2, y2), its line at `at` (y for a horizontal one, x for a vertical one). */
  | { kind: 'dimension'; x1: number; y1: number; x2: number; y2: number; at: number; label: string }
  /** A label with a leader to (x, y), its text at (tx, ty). */
  | { kind: 'leader'; x: number; y: number; tx: number; ty: number; label: string };

export interface WindingDrawing {
  /** What is drawn, in a sentence (the figure's caption and the SVG's accessible name). */
  title: string;
  shapes: DrawingShape[];
  /** Sentences under the drawing: turns and layers, keep-out, gap, what is to scale. */
  notes: string[];
}

const mm = (m: number) => millimetre(m, 3);

/** The winding as shapes in metres: a section through one window of a shaped core, or a ring seen along its axis. */
export function windingDrawing(input: WindingDrawingInput): WindingDrawing {
  if (!(input.turns >= 1 && input.turnsPerLayer >= 1 && Number.isFinite(input.layers) && input.layers >= 1)) {
    return { title: 'Winding section', shapes: [], notes: ['The wire does not fit this core: no winding to draw.'] };
  }
  return input.core.ring ? ringDrawing(input, input.core.ring) : windowDrawing(input);
}

function turnsNote(input: WindingDrawingInput): string {
  const { turns, layers, turnsPerLayer, wire } = input;
  const last = turns - turnsPerLayer * (layers - 1);
  const lastText = layers > 1 && last !== turnsPerLayer ? ` (${last} on the last)` : '';
  const conductor =
    wire.kind === 'foil'
      ? `copper foil ${mm(wire.strandDiameter)} thick, one turn per layer`
      : wire.kind === 'litz'
        ? `litz bundle Ø ${mm(wire.overallDiameter)}`
        : `${wire.conductorsPerTurn} in hand, Ø ${mm(wire.overallDiameter)} over enamel`;
  return `${turns} turns in ${layers} layer${layers === 1 ? '' : 's'} of ${turnsPerLayer}${lastText}; ${conductor}.`;
}

/** A shape drawn with x out from the leg and y along it, turned so the leg lies along x and the layers stack up. */
function onItsSide(s: DrawingShape): DrawingShape {
  switch (s.kind) {
    case 'rect':
      return { ...s, x: s.y, y: s.x, width: s.height, height: s.width };
    case 'circle':
    case 'annulus':
      return { ...s, cx: s.cy, cy: s.cx };
    case 'line':
    case 'dimension':
      return { ...s, x1: s.y1, y1: s.x1, x2: s.y2, y2: s.x2 };
    case 'leader':
      return { ...s, x: s.y, y: s.x, tx: s.ty, ty: s.tx };
  }
}

/** One window of an E/ETD/PQ/RM/pot core: half the centre leg from the axis, the window, the outer leg, the yokes. */
function windowDrawing(input: WindingDrawingInput): WindingDrawing {
  const { core, wire, layers, turnsPerLayer, turns } = input;
  const W = core.windowWidth;
  const H = core.windowHeight;
  const half = core.centreLeg / 2;
  const top = H / 2 + core.yoke;
  const right = W + core.outerLeg;
  const shapes: DrawingShape[] = [];
  const rect = (role: DrawingRole, x0: number, y0: number, x1: number, y1: number, hatch?: boolean) => {
    if (x1 > x0 && y1 > y0) shapes.push({ kind: 'rect', role, x: x0, y: y0, width: x1 - x0, height: y1 - y0, ...(hatch ? { hatch } : {}) });
  };

  // Core: yokes, centre leg and outer leg in two halves, open at their gaps on the mating plane.
  const centreGap = input.gap ? (input.gap.placement === 'spacer' ? input.gap.spacer : input.gap.total) : 0;
  const outerGap = input.gap?.placement === 'spacer' ? input.gap.spacer : 0;
  rect('core', -half, H / 2, right, top);
  rect('core', -half, -top, right, -H / 2);
  rect('core', -half, centreGap / 2, 0, H / 2);
  rect('core', -half, -H / 2, 0, -centreGap / 2);
  rect('core', W, outerGap / 2, right, H / 2);
  rect('core', W, -H / 2, right, -outerGap / 2);
  rect('gap', -half, -centreGap / 2, 0, centreGap / 2);
  rect('gap', W, -outerGap / 2, right, outerGap / 2);
  shapes.push({ kind: 'line', role: 'axis', x1: -half, y1: -top * 1.06, x2: -half, y2: top * 1.06, dashed: true });

  // Bobbin: the tube on the leg (the engine's 0.5 mm wall) and a flange each end of the winding width.
  const wall = DEFAULT_KEEP_OUT;
  const flange = Math.max(0, (H - core.bobbinWidth) / 2);
  const bobbinOuter = Math.min(W, wall + core.bobbinHeight);
  const bw = Math.min(core.bobbinWidth, H);
  rect('bobbin', 0, -H / 2, wall, H / 2);
  rect('bobbin', wall, H / 2 - flange, bobbinOuter, H / 2);
  rect('bobbin', wall, -H / 2, bobbinOuter, -H / 2 + flange);

  // Copper starts at the keep-out (the tube's wall counts; tape builds up the rest).
  const keepOut = input.keepOut;
  const x0 = Math.max(wall, keepOut ?? 0);
  if (keepOut !== null && keepOut > wall) rect('tape', wall, -bw / 2, keepOut, bw / 2);
  const d = wire.overallDiameter;
  const build = layers * d;

  if (wire.kind === 'foil') {
    const foilWidth = Math.max(0, bw - 2 * FOIL_EDGE_MARGIN);
    for (let k = 0; k < layers; k++) {
      const x = x0 + k * d;
      rect('copper', x, -foilWidth / 2, x + wire.strandDiameter, foilWidth / 2);
      rect('insulation', x + wire.strandDiameter, -bw / 2, x + d, bw / 2);
    }
  } else {
    // Layers outward from the leg, each centred on the mating plane (the gap), the last filled from one end: as the
    // engine's field model lays them (gap-field-loss.ts). Wires in hand lie side by side along the layer.
    const cpt = wire.conductorsPerTurn;
    const full = turnsPerLayer * cpt;
    for (let k = 0; k < layers; k++) {
      const cx = x0 + (k + 0.5) * d;
      const inLayer = Math.min(turnsPerLayer, turns - k * turnsPerLayer);
      for (let t = 0; t < inLayer; t++) {
        for (let c = 0; c < cpt; c++) {
          const j = t * cpt + c;
          shapes.push({ kind: 'circle', role: 'copper', cx, cy: (j + 0.5 - full / 2) * d, r: d / 2, turn: k * turnsPerLayer + t });
        }
      }
      if (k > 0) shapes.push({ kind: 'line', role: 'tape', x1: x0 + k * d, y1: -bw / 2, x2: x0 + k * d, y2: bw / 2 });
    }
  }
  shapes.push({ kind: 'line', role: 'tape', x1: x0 + build, y1: -bw / 2, x2: x0 + build, y2: bw / 2 });
  if (keepOut !== null) rect('keep-out', 0, -H / 2, keepOut, H / 2, true);

  // Dimensions outside the core: keep-out above, build and bobbin height below, winding width on the right.
  const u = 0.07 * Math.max(right + half, 2 * top);
  if (keepOut !== null)
    shapes.push({ kind: 'dimension', x1: 0, y1: H / 2, x2: keepOut, y2: H / 2, at: top + u, label: `keep-out ${mm(keepOut)}` });
  shapes.push({ kind: 'dimension', x1: x0, y1: -H / 2, x2: x0 + build, y2: -H / 2, at: -top - u, label: `build ${mm(build)}` });
  shapes.push({
    kind: 'dimension',
    x1: wall,
    y1: -H / 2,
    x2: wall + core.bobbinHeight,
    y2: -H / 2,
    at: -top - 2.4 * u,
    label: `bobbin build height ${mm(core.bobbinHeight)}`,
  });
  shapes.push({
    kind: 'dimension',
    x1: bobbinOuter,
    y1: -bw / 2,
    x2: bobbinOuter,
    y2: bw / 2,
    at: right + u,
    label: `winding width ${mm(core.bobbinWidth)}`,
  });

  const notes = [turnsNote(input)];
  if (input.gap) {
    const gapLabel =
      input.gap.placement === 'spacer' ? `spacer ${mm(input.gap.spacer)} (all legs)` : `gap ${mm(input.gap.total)} (centre leg)`;
    shapes.push({ kind: 'leader', x: -half / 2, y: 0, tx: -half - 1.5 * u, ty: 0, label: gapLabel });
    notes.push(
      input.gap.placement === 'spacer'
        ? `Spacer ${mm(input.gap.spacer)} under all legs: a gap at the centre leg and at the outer leg on the mating plane (${mm(input.gap.total)} in the magnetic path).`
        : `Ground gap ${mm(input.gap.total)} in the centre leg, on the mating plane at mid-height of the winding.`,
    );
  }
  if (keepOut !== null) {
    const tape = keepOut > wall ? `; tape builds up the other ${mm(keepOut - wall)}` : '';
    notes.push(`Keep-out (hatched): no copper within ${mm(keepOut)} of the centre leg; the bobbin tube's ${mm(wall)} wall counts${tape}.`);
  }
  if (wire.kind === 'foil') notes.push(`Foil centred with ${mm(FOIL_EDGE_MARGIN)} edge margins, interlayer film between turns.`);
  else if (layers > 1) notes.push('One wrap of interlayer tape between layers (drawn as a line, its thickness not to scale).');
  if (x0 + build > wall + core.bobbinHeight) notes.push('The build does not fit the bobbin: the winding runs past its build height.');
  notes.push(
    'To scale: window, bobbin, winding, keep-out and gap from the engine’s figures; the legs and yokes are indicative. Dash-dot: the core’s axis.',
  );
  return { title: `Winding section through one window, ${turns} turns`, shapes: shapes.map(onItsSide), notes };
}

/**
 * A ring seen along its axis: the turns on the inside layer by layer as the engine lays them (layer k on the
 * circumference π·(ID − (2k + 1)·d_o), floor(that / pitch) turns), and each turn's return on the outside.
 */
function ringDrawing(input: WindingDrawingInput, ring: { od: number; id: number; height: number }): WindingDrawing {
  const { wire, turns } = input;
  const d = wire.overallDiameter;
  const cpt = wire.conductorsPerTurn;
  const pitch = cpt * d;
  const shapes: DrawingShape[] = [{ kind: 'annulus', role: 'core', cx: 0, cy: 0, r: ring.od / 2, inner: ring.id / 2 }];
  let placed = 0;
  let layers = 0;
  while (placed < turns) {
    const inside = Math.PI * (ring.id - (2 * layers + 1) * d);
    const inLayer = Math.min(turns - placed, Math.floor(inside / pitch));
    if (inLayer < 1) break;
    const rIn = ring.id / 2 - (layers + 0.5) * d;
    const rOut = ring.od / 2 + (layers + 0.5) * d;
    for (let t = 0; t < inLayer; t++) {
      for (let c = 0; c < cpt; c++) {
        const angle = Math.PI / 2 - ((t * cpt + c + 0.5) * d) / rIn;
        shapes.push({ kind: 'circle', role: 'copper', cx: rIn * Math.cos(angle), cy: rIn * Math.sin(angle), r: d / 2, turn: placed + t });
        shapes.push({ kind: 'circle', role: 'copper', cx: rOut * Math.cos(angle), cy: rOut * Math.sin(angle), r: d / 2 });
      }
    }
    placed += inLayer;
    layers += 1;
  }
  const build = layers * d;
  const outer = ring.od / 2 + build;
  const u = 0.12 * outer;
  shapes.push(
    { kind: 'line', role: 'axis', x1: -outer - u / 2, y1: 0, x2: outer + u / 2, y2: 0, dashed: true },
    { kind: 'line', role: 'axis', x1: 0, y1: -outer - u / 2, x2: 0, y2: outer + u / 2, dashed: true },
    { kind: 'dimension', x1: -ring.od / 2, y1: 0, x2: ring.od / 2, y2: 0, at: -outer - u, label: `OD ${mm(ring.od)}` },
    { kind: 'dimension', x1: -ring.id / 2, y1: 0, x2: ring.id / 2, y2: 0, at: outer + u, label: `ID ${mm(ring.id)}` },
    { kind: 'dimension', x1: ring.id / 2 - build, y1: 0, x2: ring.id / 2, y2: 0, at: -outer - 2.4 * u, label: `build ${mm(build)}` },
  );
  return {
    title: `Ring winding seen along the axis, ${turns} turns`,
    shapes,
    notes: [
      turnsNote(input),
      'Ring seen along its axis, to scale: the turns on the inside layer by layer as the engine lays them, each turn’s return on the outside. No bobbin, no gap.',
    ],
  };
}
