// A winding drawing (metres, y up) fitted into a box (px or pt, y down), with its dimensions, hatching and a scale
// bar turned into plain rectangles, circles, lines, polygons and text: what the SVG component and the PDF paint.
import type { DrawingRole, DrawingShape, WindingDrawing } from './winding-drawing';

export type PlacedShape =
  | { kind: 'rect'; role: DrawingRole; x: number; y: number; width: number; height: number }
  | { kind: 'circle'; role: DrawingRole; cx: number; cy: number; r: number }
  | { kind: 'annulus'; role: DrawingRole; cx: number; cy: number; r: number; inner: number }
  | { kind: 'line'; role: DrawingRole; x1: number; y1: number; x2: number; y2: number; dashed?: boolean; thin?: boolean }
  | { kind: 'polygon'; role: DrawingRole; points: [number, number][] }
  /** Text centred across its line on (x, y); `anchor` is where that point is along the text; `vertical` reads upward. */
  | { kind: 'text'; role: DrawingRole; x: number; y: number; text: string; anchor: 'start' | 'middle' | 'end'; vertical?: boolean };

export interface PlacedDrawing {
  width: number;
  height: number;
  /** Box units per metre. */
  scale: number;
  fontSize: number;
  shapes: PlacedShape[];
}

export interface DrawingBox {
  width: number;
  height: number;
  fontSize?: number;
}

/** Room kept for the dimension texts outside the shapes (box units). */
const PAD = { left: 40, right: 40, top: 28, bottom: 40 };
const ARROW = 6;
const HATCH_SPACING = 6;
/** A gap thinner than this in the box is drawn this thick, so it stays visible (box units). */
const MIN_GAP = 1.5;

/** Points whose box holds a shape (m): a dimension's line too, not its text. */
function corners(s: DrawingShape): [number, number][] {
  switch (s.kind) {
    case 'rect':
      return [
        [s.x, s.y],
        [s.x + s.width, s.y + s.height],
      ];
    case 'circle':
    case 'annulus':
      return [
        [s.cx - s.r, s.cy - s.r],
        [s.cx + s.r, s.cy + s.r],
      ];
    case 'line':
      return [
        [s.x1, s.y1],
        [s.x2, s.y2],
      ];
    case 'dimension':
      return [[s.x1, s.y1], [s.x2, s.y2], s.y1 === s.y2 ? [s.x1, s.at] : [s.at, s.y1]];
    case 'leader':
      return [
        [s.x, s.y],
        [s.tx, s.ty],
      ];
  }
}

/** Extent of the drawing's geometry (m): shapes and dimension lines, not their texts. */
function extent(drawing: WindingDrawing) {
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  const add = (x: number, y: number) => {
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  };
  for (const s of drawing.shapes) {
    for (const [x, y] of corners(s)) add(x, y);
  }
  return { minX, maxX, minY, maxY };
}

/** A round length for the scale bar: 1, 2 or 5 × 10ⁿ m, about a fifth of the box. */
function scaleBarLength(scale: number, width: number): number {
  const target = width / 5 / scale;
  const decade = 10 ** Math.floor(Math.log10(target));
  return (
    [1, 2, 5, 10]
      .map((f) => f * decade)
      .filter((l) => l <= target * 1.5)
      .pop() ?? decade
  );
}

/** Hatch lines at 45° inside a rectangle (box units). */
function hatch(x: number, y: number, w: number, h: number): [number, number, number, number][] {
  const lines: [number, number, number, number][] = [];
  // Lines x − y = c for c from x − (y + h) to (x + w) − y: clip each to the rectangle.
  for (let c = x - (y + h) + HATCH_SPACING / 2; c < x + w - y; c += HATCH_SPACING) {
    const xa = Math.max(x, c + y);
    const xb = Math.min(x + w, c + y + h);
    if (xb > xa) lines.push([xa, xa - c, xb, xb - c]);
  }
  return lines;
}

/** Fit the drawing into the box, uniformly scaled (to scale), with its dimensions and a scale bar. */
export function layoutDrawing(drawing: WindingDrawing, box: DrawingBox): PlacedDrawing {
  const fontSize = box.fontSize ?? 11;
  const shapes: PlacedShape[] = [];
  if (drawing.shapes.length === 0) return { width: box.width, height: box.height, scale: 0, fontSize, shapes };
  const e = extent(drawing);
  const scale = Math.min((box.width - PAD.left - PAD.right) / (e.maxX - e.minX), (box.height - PAD.top - PAD.bottom) / (e.maxY - e.minY));
  // Centre what is drawn in the room left by the padding.
  const ox = PAD.left + (box.width - PAD.left - PAD.right - (e.maxX - e.minX) * scale) / 2;
  const oy = PAD.top + (box.height - PAD.top - PAD.bottom - (e.maxY - e.minY) * scale) / 2;
  const X = (x: number) => ox + (x - e.minX) * scale;
  const Y = (y: number) => oy + (e.maxY - y) * scale;
  const arrow = (x: number, y: number, dx: number, dy: number): PlacedShape => ({
    kind: 'polygon',
    role: 'dimension',
    points: [
      [x, y],
      [x - dx * ARROW - dy * ARROW * 0.35, y - dy * ARROW + dx * ARROW * 0.35],
      [x - dx * ARROW + dy * ARROW * 0.35, y - dy * ARROW - dx * ARROW * 0.35],
    ],
  });

  for (const s of drawing.shapes) {
    switch (s.kind) {
      case 'rect': {
        let y = Y(s.y + s.height);
        let height = s.height * scale;
        if (s.role === 'gap' && height < MIN_GAP) {
          y -= (MIN_GAP - height) / 2;
          height = MIN_GAP;
        }
        const r = { kind: 'rect' as const, role: s.role, x: X(s.x), y, width: s.width * scale, height };
        if (s.hatch) {
          shapes.push(r);
          for (const [x1, y1, x2, y2] of hatch(r.x, r.y, r.width, r.height))
            shapes.push({ kind: 'line', role: s.role, x1, y1, x2, y2, thin: true });
        } else shapes.push(r);
        break;
      }
      case 'circle':
        shapes.push({ kind: 'circle', role: s.role, cx: X(s.cx), cy: Y(s.cy), r: s.r * scale });
        break;
      case 'annulus':
        shapes.push({ kind: 'annulus', role: s.role, cx: X(s.cx), cy: Y(s.cy), r: s.r * scale, inner: s.inner * scale });
        break;
      case 'line':
        shapes.push({
          kind: 'line',
          role: s.role,
          x1: X(s.x1),
          y1: Y(s.y1),
          x2: X(s.x2),
          y2: Y(s.y2),
          ...(s.dashed ? { dashed: true } : {}),
        });
        break;
      case 'dimension': {
        const horizontal = s.y1 === s.y2;
        const [ax, ay, bx, by] = horizontal ? [X(s.x1), Y(s.at), X(s.x2), Y(s.at)] : [X(s.at), Y(s.y1), X(s.at), Y(s.y2)];
        shapes.push(
          { kind: 'line', role: 'dimension', x1: X(s.x1), y1: Y(s.y1), x2: ax, y2: ay, thin: true },
          { kind: 'line', role: 'dimension', x1: X(s.x2), y1: Y(s.y2), x2: bx, y2: by, thin: true },
        );
        const length = Math.hypot(bx - ax, by - ay);
        const [dx, dy] = [(bx - ax) / (length || 1), (by - ay) / (length || 1)];
        if (length >= 3 * ARROW) {
          shapes.push({ kind: 'line', role: 'dimension', x1: ax, y1: ay, x2: bx, y2: by }, arrow(ax, ay, -dx, -dy), arrow(bx, by, dx, dy));
        } else {
          // Too short for arrows inside: arrows outside pointing in, with a stub each side.
          shapes.push(
            {
              kind: 'line',
              role: 'dimension',
              x1: ax - dx * 3 * ARROW,
              y1: ay - dy * 3 * ARROW,
              x2: bx + dx * 3 * ARROW,
              y2: by + dy * 3 * ARROW,
            },
            arrow(ax, ay, dx, dy),
            arrow(bx, by, -dx, -dy),
          );
        }
        // The text along the line, on its outer side.
        const outward = horizontal ? (s.at > s.y1 ? -1 : 1) : s.at > s.x1 ? 1 : -1;
        shapes.push(
          horizontal
            ? { kind: 'text', role: 'dimension', x: (ax + bx) / 2, y: ay + outward * fontSize * 0.8, text: s.label, anchor: 'middle' }
            : {
                kind: 'text',
                role: 'dimension',
                x: ax + outward * fontSize * 0.8,
                y: (ay + by) / 2,
                text: s.label,
                anchor: 'middle',
                vertical: true,
              },
        );
        break;
      }
      case 'leader': {
        const [tx, ty] = [X(s.tx), Y(s.ty)];
        const sideways = Math.abs(s.tx - s.x) > Math.abs(s.ty - s.y);
        const text: PlacedShape = sideways
          ? {
              kind: 'text',
              role: 'dimension',
              x: tx + Math.sign(s.tx - s.x) * fontSize * 0.3,
              y: ty,
              text: s.label,
              anchor: s.tx < s.x ? 'end' : 'start',
            }
          : { kind: 'text', role: 'dimension', x: tx, y: ty + Math.sign(s.y - s.ty) * fontSize * 0.7, text: s.label, anchor: 'middle' };
        shapes.push({ kind: 'line', role: 'dimension', x1: tx, y1: ty, x2: X(s.x), y2: Y(s.y), thin: true }, text);
        break;
      }
    }
  }

  // Scale bar, top left.
  const bar = scaleBarLength(scale, box.width);
  const bx = 4;
  const by = fontSize;
  shapes.push(
    { kind: 'rect', role: 'dimension', x: bx, y: by - 2, width: bar * scale, height: 4 },
    { kind: 'text', role: 'dimension', x: bx + bar * scale + 6, y: by, text: `${Number((bar * 1e3).toPrecision(3))} mm`, anchor: 'start' },
  );
  return { width: box.width, height: box.height, scale, fontSize, shapes };
}
