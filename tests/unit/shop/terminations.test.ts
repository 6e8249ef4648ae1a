import { describe, expect, it } from 'vitest';
import { planTerminations } from '@shared/shop/terminations';

// A bobbin pin takes about 1 mm² of copper and 4 A (common practice, no source: shared/shop/build-practice.ts).
const wire = (d: number) => (Math.PI / 4) * d * d;

describe('terminations by pin count and pin current', () => {
  it('puts seven 1.0 mm wires in hand (5.5 mm²) on a strap when the bobbin has too few pins a side', () => {
    // RM4: 6 pins, 3 a side; 5.5 mm² needs 6 pins an end.
    const plan = planTerminations({ family: 'RM', coreId: 'RM4', wireKind: 'awg', strands: 7, strandArea: wire(1e-3), rmsCurrent: 15 });
    expect(plan.kind).toBe('strap');
    expect(plan.strapArea * 1e6).toBeCloseTo(7 * wire(1e-3) * 1e6, 6);
    expect(plan.lines.join(' ')).toMatch(/copper strap\/bus or flying leads.*at least 5\.5 mm²/);
    expect(plan.lines.join(' ')).not.toMatch(/on one pin/);
  });

  it('splits the same wires over pins where the bobbin has them: one 1.0 mm wire (0.785 mm²) a pin, 7 pins an end', () => {
    const plan = planTerminations({
      family: 'ETD',
      coreId: 'ETD59/31/22',
      wireKind: 'awg',
      strands: 7,
      strandArea: wire(1e-3),
      rmsCurrent: 15,
    });
    expect(plan.kind).toBe('pins');
    expect(plan.perPin).toBe(1);
    expect(plan.startPins).toEqual([1, 2, 3, 4, 5, 6, 7]);
    expect(plan.finishPins).toEqual([11, 12, 13, 14, 15, 16, 17]);
  });

  it('takes more pins for current than copper: 8 × 0.227 mm (0.32 mm²) at 9 A needs 3 pins an end', () => {
    const plan = planTerminations({
      family: 'PQ',
      coreId: 'PQ26/25',
      wireKind: 'awg',
      strands: 8,
      strandArea: wire(0.227e-3),
      rmsCurrent: 9,
    });
    expect(plan.kind).toBe('pins');
    expect(plan.startPins).toEqual([1, 2, 3]);
    expect(plan.perPin).toBe(3);
  });

  it('keeps a thin single wire on one pin each end', () => {
    const plan = planTerminations({
      family: 'E',
      coreId: 'E20/10/6',
      wireKind: 'awg',
      strands: 1,
      strandArea: wire(0.5e-3),
      rmsCurrent: 1,
    });
    expect(plan.startText).toBe('Start on pin 1 (at the bobbin tube)');
    expect(plan.finishText).toMatch(/^Finish on pin 6 /);
  });

  it('gives rings flying leads and foil its tabs', () => {
    expect(
      planTerminations({ family: 'RING', coreId: 'R10/6/4', wireKind: 'awg', strands: 2, strandArea: wire(0.5e-3), rmsCurrent: 2 }).kind,
    ).toBe('flying-leads');
    const foil = planTerminations({ family: 'ETD', coreId: 'ETD34/17/11', wireKind: 'foil', strands: 1, strandArea: 6e-6, rmsCurrent: 20 });
    expect(foil.kind).toBe('foil-tabs');
    expect(foil.lines[0]).toMatch(/tab\) of at least 6 mm²/);
  });
});
