// Every character the winding sheet prints must exist in the fonts its PDF embeds: a missing glyph prints as an empty
// box (the sheet once said "Keep copper ≥ 1 mm" and "±10 µm changes L by ∓0.8 %", both with boxes in the PDF).
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { sheetSections } from '@shared/shop/sheet-text';
import { isGreek, SHEET_FONTS } from '../../../server/shop/sheet-pdf.ts';
import { etd34Like, ferriteA, powderP, powderRing, roundWire } from '../engine/fixtures';
import { EXAMPLE_SPECS } from '../../support/example-specs';
import { testSheet } from '../../support/winding-sheet';

interface Font {
  hasGlyphForCodePoint(codePoint: number): boolean;
}
const fontkit = createRequire(import.meta.url)('fontkit') as { openSync(path: string): Font };
const latin = fontkit.openSync(SHEET_FONTS.regular);
const bold = fontkit.openSync(SHEET_FONTS.bold);
const greek = fontkit.openSync(SHEET_FONTS.greek);

const sheetOf = (input: EvaluateInput, placement?: 'spacer') =>
  testSheet(evaluateDesign(placement ? { ...input, placement } : input), input.wire, input.core, 'glyph test', { required: true });

function missing(text: string, font: Font): string[] {
  return [...new Set([...text])].filter((ch) => !(isGreek(ch) ? greek : font).hasGlyphForCodePoint(ch.codePointAt(0)!));
}

describe('the sheet PDF has a glyph for every character it prints', () => {
  const gapped: EvaluateInput = {
    spec: EXAMPLE_SPECS.C,
    core: etd34Like,
    material: ferriteA,
    turns: 'auto',
    gap: 'auto',
    wire: roundWire(1e-3, 3),
  };
  const ring: EvaluateInput = { ...gapped, core: powderRing, material: powderP };
  for (const [name, sheet] of [
    ['ground gap', sheetOf(gapped)],
    ['spacer', sheetOf(gapped, 'spacer')],
    ['powder ring', sheetOf(ring)],
  ] as const) {
    it(name, () => {
      const sections = sheetSections(sheet);
      const values = [sheet.caution, ...sections.flatMap((s) => s.lines.map(([, value]) => value))].join(' ');
      const labels = sections.flatMap((s) => [s.title, ...s.lines.map(([label]) => label)]).join(' ');
      expect(missing(values, latin)).toEqual([]);
      expect(missing(labels, bold)).toEqual([]);
    });
  }
});
