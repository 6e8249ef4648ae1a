// What the shop is told to build for each gap placement: the winding sheet and the BOM.
import { describe, expect, it } from 'vitest';
import { evaluateDesign, type EvaluateInput } from '@shared/engine/evaluate';
import { windingSheetSchema } from '@shared/schemas/winding-sheet';
import { sheetSections } from '@shared/shop/sheet-text';
import { buildBom } from '../../../server/exports/bom.ts';
import { buildWindingSheet } from '../../../server/shop/winding-sheet.ts';
import { etd34Like, ferriteA, roundWire } from '../engine/fixtures';
import { spacerLOf } from '../engine/mclyman';
import { EXAMPLE_SPECS } from '../../support/example-specs';

const base: EvaluateInput = {
  spec: EXAMPLE_SPECS.C,
  core: etd34Like,
  material: ferriteA,
  turns: 'auto',
  gap: 'auto',
  wire: roundWire(1e-3, 3),
};
const sheetOf = (input: EvaluateInput) =>
  buildWindingSheet({
    design: { number: 'GW-0001', title: 'gap test' },
    revision: { revision: 1, engineVersion: 'test', inductanceTolerance: 0.1 },
    order: { number: 'BO-1', quantity: 1, releasedAt: new Date('2026-01-01T00:00:00Z') },
    author: 'erin',
    approver: 'ruth',
    result: evaluateDesign(input),
    core: etd34Like,
    wire: input.wire,
    insulation: { required: false },
  });
const mm3 = (m: number) => `${(m * 1e3).toFixed(3)} mm`;
const percent = (x: number) => `${Math.abs(x * 100).toFixed(1)} %`;

describe('winding sheet and BOM for a ground centre gap', () => {
  const result = evaluateDesign(base);
  const sheet = sheetOf(base);
  const gap = sheet.parts.gap;

  it('says to grind the centre leg to the gap and how much 10 µm moves L', () => {
    expect(gap.kind).toBe('centre-leg ground');
    expect(gap.groundDepth).toBe(result.gap.total);
    expect(gap.note).toMatch(new RegExp(`^Grind the centre leg to a gap of ${mm3(result.gap.total)} `));
    expect(gap.note).toContain(`10 µm more gap lowers L by ${percent(result.gap.sensitivity10um)}`);
    expect(sheet.assembly[0]).toMatch(/ground gap with a feeler gauge/);
  });

  it('offers the spacer of the same inductance, never half the gap (two gaps in series, McLyman F)', () => {
    expect(gap.spacerAlternative).toBe(result.gap.spacer);
    expect(gap.note).toContain(`a spacer ${mm3(result.gap.spacer)} thick under all legs`);
    expect(gap.note).not.toContain(mm3(result.gap.total / 2) + ' thick');
    // McLyman's closed form: the stated spacer gives the design's L; half the ground gap gives ≈12 % less
    expect(spacerLOf(etd34Like, ferriteA, result.turns, gap.spacerAlternative) / result.inductance.nominal).toBeCloseTo(1, 3);
    expect(spacerLOf(etd34Like, ferriteA, result.turns, result.gap.total / 2) / result.inductance.nominal).toBeLessThan(0.9);
    const core = buildBom({ result, materialName: 'Ferrite A' })[0]!;
    expect(core.note).toMatch(
      new RegExp(`^grind the centre leg to a gap of ${(result.gap.total * 1e3).toFixed(3)} mm \\(10 µm more gap lowers L`),
    );
    expect(core.note).toContain(`a spacer ${(result.gap.spacer * 1e3).toFixed(3)} mm thick under all legs`);
    expect(core.note).not.toMatch(/outer leg/);
  });
});

describe('winding sheet and BOM for a spacer under all legs', () => {
  const input: EvaluateInput = { ...base, placement: 'spacer' };
  const result = evaluateDesign(input);
  const sheet = sheetOf(input);
  const gap = sheet.parts.gap;

  it('gives the spacer thickness under all legs, two gaps in series, and nothing to grind', () => {
    expect(gap.kind).toBe('spacer under all legs');
    expect(gap.spacer).toBe(result.gap.spacer);
    expect(gap.groundDepth).toBe(0);
    expect(gap.note).toMatch(
      new RegExp(`^Spacer ${mm3(result.gap.spacer)} thick under all legs \\(non-magnetic, e\\.g\\. polyester film\\), two gaps in series`),
    );
    expect(gap.note).not.toMatch(/[Gg]rind the/);
    expect(sheet.assembly.join(' ')).toMatch(/spacer under every leg/);
    expect(sheet.assembly.join(' ')).not.toMatch(/feeler gauge/);
  });

  it('lists the spacer film in the BOM', () => {
    const rows = buildBom({ result, materialName: 'Ferrite A' });
    expect(rows[0]!.note).toMatch(new RegExp(`^spacer ${(result.gap.spacer * 1e3).toFixed(3)} mm thick under all legs`));
    expect(rows.map((r) => r.item)).toEqual(['Core set', 'Spacer', 'Bobbin', 'Clips', 'Wire', 'Copper mass', 'Tape']);
  });

  it('still reads a sheet frozen before placements existed (a ground design without spacer and sensitivity)', () => {
    const { spacer: _spacer, sensitivity10um: _s, ...oldGap } = sheetOf(base).parts.gap;
    const old = { ...sheetOf(base), parts: { ...sheetOf(base).parts, gap: oldGap } };
    const read = windingSheetSchema.parse(old);
    expect(read.parts.gap).toMatchObject({ kind: 'centre-leg ground', spacer: 0, sensitivity10um: 0 });
  });
});

describe('winding sheet: the keep-out from the gap', () => {
  const line = (sheet: ReturnType<typeof sheetOf>) =>
    sheetSections(sheet)
      .flatMap((section) => section.lines)
      .find(([label]) => label === 'Keep-out');

  it('tells the shop to keep the copper the evaluated distance from the gap, the limit or a larger one', () => {
    const sheet = sheetOf({ ...base, keepOut: 1.5e-3 });
    expect(sheet.winding.keepOut).toBe(1.5e-3);
    expect(line(sheet)?.[1]).toMatch(/^Keep copper at least 1\.5 mm from the gap \(centre leg\)/);
    expect(windingSheetSchema.parse(sheet).winding.keepOut).toBe(1.5e-3);
    expect(line(sheetOf(base))?.[1]).toMatch(/^Keep copper at least 0\.5 mm from the gap/);
  });

  it('has no keep-out line without an air gap, and reads a sheet released before the keep-out was given', () => {
    const sheet = sheetOf(base);
    const { keepOut: _dropped, ...olderWinding } = sheet.winding;
    const older = windingSheetSchema.parse({ ...sheet, winding: olderWinding });
    expect(older.winding.keepOut).toBeUndefined();
    expect(line(older)).toBeUndefined();
    expect(line({ ...sheet, winding: { ...sheet.winding, keepOut: null } })).toBeUndefined();
  });
});
