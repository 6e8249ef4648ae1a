import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@shared/engine/evaluate';
import { DEFAULT_KEEP_OUT } from '@shared/engine/inputs';
import { foilOption } from '@shared/catalogue/foil';
import { layoutDrawing } from '@shared/shop/drawing-layout';
import { windingDrawing, windingDrawingInput, type DrawingShape } from '@shared/shop/winding-drawing';
import { etd34Like, ferriteA, powderP, powderRing, roundWire, sectionOneSpec, workedDesign } from '../engine/fixtures';
import { EXAMPLE_SPECS } from '../../support/example-specs';

// The drawing lies on its side: x along the centre leg (0 on the mating plane), y out from the leg face.
const copper = (shapes: DrawingShape[]) =>
  shapes.filter((s) => s.kind === 'circle' && s.role === 'copper') as Extract<DrawingShape, { kind: 'circle' }>[];
const rects = (shapes: DrawingShape[], role: string) =>
  shapes.filter((s) => s.kind === 'rect' && s.role === role) as Extract<DrawingShape, { kind: 'rect' }>[];
const dimension = (shapes: DrawingShape[], label: RegExp) =>
  shapes.find((s) => s.kind === 'dimension' && label.test(s.label)) as Extract<DrawingShape, { kind: 'dimension' }> | undefined;

describe('the winding drawing of a round-wire winding on an ETD34-like core (ground gap, keep-out 0.8 mm)', () => {
  const wire = workedDesign.wire; // three 0.8 mm wires in hand
  const result = evaluateDesign({ ...workedDesign, keepOut: 0.8e-3 });
  const input = windingDrawingInput(result, etd34Like, wire);
  const drawing = windingDrawing(input);
  const circles = copper(drawing.shapes);

  it('draws every conductor of every turn: turns × wires in hand circles, each turn numbered once', () => {
    expect(wire.conductorsPerTurn).toBe(3);
    expect(circles).toHaveLength(result.turns * 3);
    expect(new Set(circles.map((c) => c.turn))).toEqual(new Set(Array.from({ length: result.turns }, (_, i) => i)));
  });

  it('lays them in the engine’s layers, at most turnsPerLayer turns in each, the layer pitch the overall diameter', () => {
    const layerHeights = [...new Set(circles.map((c) => Number(c.cy.toFixed(9))))].sort((a, b) => a - b);
    expect(layerHeights).toHaveLength(result.winding.layers);
    for (const [k, y] of layerHeights.entries()) {
      expect(y).toBeCloseTo(0.8e-3 + (k + 0.5) * wire.overallDiameter, 9);
      expect(circles.filter((c) => Math.abs(c.cy - y) < 1e-9).length).toBeLessThanOrEqual(result.winding.turnsPerLayer * 3);
    }
    for (const c of circles) expect(2 * c.r).toBeCloseTo(wire.overallDiameter, 12);
  });

  it('keeps the copper inside the winding width, clear of the keep-out, and the build inside the bobbin height', () => {
    for (const c of circles) {
      expect(Math.abs(c.cx) + c.r).toBeLessThanOrEqual(etd34Like.bobbinWidth / 2 + 1e-12);
      expect(c.cy - c.r).toBeGreaterThanOrEqual(0.8e-3 - 1e-12);
    }
    const top = Math.max(...circles.map((c) => c.cy + c.r));
    expect(top - 0.8e-3).toBeCloseTo(result.winding.buildHeight, 12);
    expect(top).toBeLessThanOrEqual(DEFAULT_KEEP_OUT + etd34Like.bobbinHeight);
  });

  it('hatches a keep-out zone as wide as the result’s keep-out from the leg face, and dimensions it in mm', () => {
    const [zone] = rects(drawing.shapes, 'keep-out');
    expect(zone.y).toBe(0);
    expect(zone.height).toBeCloseTo(result.winding.keepOut!, 12);
    expect(zone.hatch).toBe(true);
    expect(dimension(drawing.shapes, /^keep-out 0\.8 mm$/)).toBeDefined();
    expect(dimension(drawing.shapes, /^build /)!.label).toBe(`build ${Number((result.winding.buildHeight * 1e3).toPrecision(3))} mm`);
    expect(dimension(drawing.shapes, /^winding width 21 mm$/)).toBeDefined();
  });

  it('opens the ground gap in the centre leg only, on the mating plane, as long as the result’s gap', () => {
    const gaps = rects(drawing.shapes, 'gap');
    expect(gaps).toHaveLength(1);
    expect(gaps[0].x + gaps[0].width / 2).toBeCloseTo(0, 15);
    expect(gaps[0].width).toBeCloseTo(result.gap.total, 12);
    expect(gaps[0].y + gaps[0].height).toBeCloseTo(0, 15); // the centre leg lies below the leg face
    expect(drawing.notes.join(' ')).toMatch(/Ground gap 0\.\d+ mm in the centre leg/);
  });

  it('fits the box to scale: every circle’s diameter is the overall diameter × the one scale', () => {
    const placed = layoutDrawing(drawing, { width: 640, height: 360 });
    const placedCircles = placed.shapes.filter((s) => s.kind === 'circle');
    expect(placedCircles).toHaveLength(circles.length);
    for (const c of placedCircles) expect(2 * c.r).toBeCloseTo(wire.overallDiameter * placed.scale, 9);
    for (const s of placed.shapes) {
      if (s.kind === 'rect' || s.kind === 'circle') {
        const [x, y] = s.kind === 'rect' ? [s.x, s.y] : [s.cx - s.r, s.cy - s.r];
        expect(x).toBeGreaterThanOrEqual(0);
        expect(y).toBeGreaterThanOrEqual(0);
        expect(x).toBeLessThanOrEqual(640);
        expect(y).toBeLessThanOrEqual(360);
      }
    }
    // the scale bar is a round length at the same scale
    const bar = placed.shapes.find((s) => s.kind === 'text' && / mm$/.test(s.text) && s.y === placed.fontSize) as { text: string };
    const barRect = placed.shapes.find((s) => s.kind === 'rect' && s.role === 'dimension') as { width: number };
    expect(barRect.width / placed.scale).toBeCloseTo(Number.parseFloat(bar.text) * 1e-3, 12);
  });
});

describe('the winding drawing of other windings', () => {
  it('opens a spacer design at every leg on the mating plane, each gap the spacer thick', () => {
    const result = evaluateDesign({ ...workedDesign, placement: 'spacer' });
    const drawing = windingDrawing(windingDrawingInput(result, etd34Like, workedDesign.wire));
    const gaps = rects(drawing.shapes, 'gap');
    expect(gaps).toHaveLength(2); // centre leg and outer leg
    for (const g of gaps) expect(g.width).toBeCloseTo(result.gap.spacer, 12);
    expect(drawing.notes.join(' ')).toMatch(/Spacer .* under all legs/);
  });

  it('draws foil as one strip per turn, the winding width less 0.5 mm each edge, with film between', () => {
    const wire = foilOption(0.3e-3);
    const result = evaluateDesign({ spec: EXAMPLE_SPECS.D, core: etd34Like, material: ferriteA, turns: 3, gap: 'auto', wire });
    const drawing = windingDrawing(windingDrawingInput(result, etd34Like, wire));
    const strips = rects(drawing.shapes, 'copper');
    expect(strips).toHaveLength(3);
    for (const s of strips) {
      expect(s.width).toBeCloseTo(21e-3 - 2 * 0.5e-3, 12);
      expect(s.height).toBeCloseTo(0.3e-3, 12);
    }
    expect(rects(drawing.shapes, 'insulation')).toHaveLength(3);
  });

  it('draws a ring along its axis with every turn inside, the first layer as many as the engine lays there', () => {
    const wire = roundWire(1.0e-3);
    // 60 turns of 1 mm wire (d_o 1.07 mm): layer 1 holds floor(π·(14.7 − 1.07)/1.07) = 40 (by hand), the rest layer 2.
    const result = evaluateDesign({ spec: sectionOneSpec, core: powderRing, material: powderP, turns: 60, gap: 'auto', wire });
    expect(result.winding.layers).toBe(2);
    const drawing = windingDrawing(windingDrawingInput(result, powderRing, wire));
    const inside = copper(drawing.shapes).filter((c) => c.turn !== undefined);
    expect(inside).toHaveLength(result.turns);
    const firstLayer = inside.filter((c) => Math.abs(Math.hypot(c.cx, c.cy) - (14.7e-3 / 2 - wire.overallDiameter / 2)) < 1e-9);
    expect(result.winding.turnsPerLayer).toBe(40);
    expect(firstLayer).toHaveLength(40);
    expect(rects(drawing.shapes, 'gap')).toHaveLength(0);
    expect(dimension(drawing.shapes, /^ID 14\.7 mm$/)).toBeDefined();
  });

  it('draws nothing, and says so, when the wire does not fit one turn per layer', () => {
    const result = evaluateDesign({ ...workedDesign, wire: roundWire(30e-3) });
    const drawing = windingDrawing(windingDrawingInput(result, etd34Like, roundWire(30e-3)));
    expect(drawing.shapes).toEqual([]);
    expect(drawing.notes[0]).toMatch(/does not fit/);
  });
});
