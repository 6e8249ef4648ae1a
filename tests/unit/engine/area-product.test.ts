import { describe, expect, it } from 'vitest';
import {
  availableAreaProduct,
  availableGeometryConstant,
  rankByAreaProduct,
  requiredAreaProduct,
  requiredGeometryConstant,
} from '@shared/engine/area-product';
import { e25Like, etd34Like, etd44Like } from './fixtures';

describe('area product', () => {
  it('requires 0.641 cm⁴ for the worked buck example (computed from McLyman, Transformer and Inductor Design Handbook, Ap = L·Ipk·Irms/(Bmax·J·Ku) — from memory)', () => {
    // L = 8e-5/3 H and Irms = sqrt(10² + 3²/12) A, the unrounded values of the worked buck example
    const ap = requiredAreaProduct(8e-5 / 3, 11.5, Math.sqrt(100.75), 0.3, 4e6, 0.4);
    expect(ap * 1e8).toBeCloseTo(0.641, 3);
  });

  it('offers ≈1.7 cm⁴ on ETD34 and ≈0.46 cm⁴ on E25/13/7 (Ap = Wa·Ae computed from IEC 61185 / IEC 63093-8 nominal data, from memory)', () => {
    expect(availableAreaProduct(etd34Like) * 1e8).toBeCloseTo(1.7, 1);
    expect(availableAreaProduct(e25Like) * 1e8).toBeCloseTo(0.46, 2);
  });

  it('lists cores smallest first with required beside available', () => {
    const rows = rankByAreaProduct([etd44Like, e25Like, etd34Like], 0.641e-8);
    expect(rows.map((r) => r.core.id)).toEqual(['E25-like', 'ETD34-like', 'ETD44-like']);
    expect(rows[0]!.ratio).toBeLessThan(1);
  });

  it('defines Kg = Ae²·Wa/MLT (Erickson & Maksimović, definition A2.1) and the copper-loss requirement (from memory)', () => {
    expect(availableGeometryConstant(etd34Like)).toBeCloseTo((97.1e-6 ** 2 * 175e-6) / 60e-3, 20);
    // Kg ≥ ρ·L²·Ipk²/(Bmax²·R·Ku): doubling the allowed resistance halves the requirement [C]
    const kg1 = requiredGeometryConstant(1.7241e-8, 26.67e-6, 11.5, 0.3, 0.01, 0.4);
    expect(requiredGeometryConstant(1.7241e-8, 26.67e-6, 11.5, 0.3, 0.02, 0.4) / kg1).toBeCloseTo(0.5, 12);
  });
});
