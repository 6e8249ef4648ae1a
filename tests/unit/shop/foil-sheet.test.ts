import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@shared/engine/evaluate';
import { foilOption } from '@shared/catalogue/foil';
import { testSheet } from '../../support/winding-sheet.ts';
import { etd34Like, ferriteA } from '../engine/fixtures';
import { EXAMPLE_SPECS } from '../../support/example-specs';

describe('a winding sheet for a foil winding', () => {
  const wire = foilOption(0.3e-3);
  const result = evaluateDesign({ spec: EXAMPLE_SPECS.D, core: etd34Like, material: ferriteA, turns: 3, gap: 'auto', wire });
  const sheet = testSheet(result, wire, etd34Like, 'foil test');

  it('names the foil thickness and its width (winding width less 0.5 mm each edge, common practice, no source)', () => {
    // ETD34-like fixture: winding width 21 mm → foil 20.0 mm wide.
    expect(sheet.parts.wire.description).toMatch(/^Copper foil 0\.300 mm thick × 20\.0 mm wide, one turn per layer/);
    expect(result.winding.layers).toBe(3);
  });

  it('asks for film under every turn and tabs at the foil ends, and weighs the foil, not a round wire', () => {
    expect(sheet.winding.interlayerTape).toMatch(/under every turn/);
    expect(sheet.terminations[0]).toMatch(/tab/);
    // copper mass = t·w·length·8,890 kg/m³ (IEC 60028 density)
    expect(sheet.parts.wire.mass).toBeCloseTo(0.3e-3 * 20e-3 * sheet.parts.wire.length * 8890, 9);
  });
});
