import type { MaterialFamily } from '@shared/engine/types';

/**
 * Invented, illustrative core materials for the demo, named by a colour each so no name echoes a maker's grade or a
 * permeability designation (migration 0009 renamed the earlier demo rows). They are not any maker's grade: each k is
 * chosen so the material loses a round, plausible amount at one stated point (common practice, no
 * source: MnZn power ferrite loses of order 50–150 kW/m³ at 100 kHz and 0.1 T peak near its
 * loss minimum; powder cores lose more at the same flux), with α and β inside the generic MnZn ranges
 * α ≈ 1.1–1.9, β ≈ 2.2–3.0 (common practice, no source). Temperature curves follow the usual parabolic
 * behaviour F0 + c·(T − T0)² (common practice, no source) with the minimum T0 near 80–100 °C.
 */
export interface DemoMaterial {
  name: string;
  family: MaterialFamily;
  alpha: number;
  beta: number;
  /** Loss density (W/m³) at the anchor point below; k follows from it. */
  anchorLoss: number;
  anchorFrequency: number;
  anchorPeakFlux: number;
  fit: { fMin: number; fMax: number; bMin: number; bMax: number };
  /** Temperature of minimum loss T0 (°C) and curvature c (1/K²); omitted for powders. */
  minimumLossAt?: { temperature: number; curvature: number };
  bsat25: number;
  bsat100: number;
  permeability: number;
  /** Powder DC-bias roll-off as μ% = 1/(1 + (H/H50)^c), H in A/m. */
  rollOff?: { h50: number; c: number };
  /**
   * Core loss under DC bias, factor 1 + (H/H₂)^m with H the DC field in the ferrite: invented, of the order published
   * ferrite measurements under bias show (the loss of order doubling at some tens of A/m; from memory).
   */
  biasLoss?: { doublingField: number; steepness: number };
  density: number;
  /** Highest tolerated hot spot (°C): powder binders age with heat, of order 125–200 °C (common practice, no source). */
  maxTemperature?: number;
}

/**
 * One demo grade as a table row: Steinmetz α and β, the loss density at the family's anchor point (W/m³), the
 * fit's frequency and peak-flux bounds, Bsat at 25 and 100 °C (T), initial permeability, density (kg/m³).
 */
type Grade = [
  grade: string,
  alpha: number,
  beta: number,
  anchorLoss: number,
  fit: [fMin: number, fMax: number, bMin: number, bMax: number],
  bsat: [at25: number, at100: number],
  permeability: number,
  density: number,
];

function demoMaterial(
  family: MaterialFamily,
  [grade, alpha, beta, anchorLoss, [fMin, fMax, bMin, bMax], [bsat25, bsat100], permeability, density]: Grade,
  anchorPeakFlux: number,
): DemoMaterial {
  return {
    name: `Demo ${family} ${grade} (illustrative)`,
    family,
    alpha,
    beta,
    anchorLoss,
    anchorFrequency: 100e3,
    anchorPeakFlux,
    fit: { fMin, fMax, bMin, bMax },
    bsat25,
    bsat100,
    permeability,
    density,
  };
}

/** A ferrite, its loss anchored at 100 kHz and 0.1 T peak, with its temperature of minimum loss (°C) and curvature (1/K²). */
const ferrite = (grade: Grade, [temperature, curvature]: [number, number]): DemoMaterial => ({
  ...demoMaterial('ferrite', grade, 0.1),
  minimumLossAt: { temperature, curvature },
});

/**
 * A powder, its loss anchored at 100 kHz and 0.05 T peak, with its DC-bias roll-off (H50 in A/m, exponent c) and
 * its highest tolerated temperature (°C).
 */
const powder = (grade: Grade, [h50, c]: [number, number], maxTemperature: number): DemoMaterial => ({
  ...demoMaterial('powder', grade, 0.05),
  rollOff: { h50, c },
  maxTemperature,
});

export const DEMO_MATERIALS: readonly DemoMaterial[] = [
  {
    ...ferrite(['Amber', 1.4, 2.65, 80e3, [50e3, 300e3, 0.02, 0.25], [0.5, 0.4], 2300, 4800], [90, 1.0e-4]),
    biasLoss: { doublingField: 60, steepness: 1.5 },
  },
  ferrite(['Teal', 1.55, 2.55, 60e3, [100e3, 1e6, 0.01, 0.15], [0.48, 0.38], 1400, 4800], [80, 1.2e-4]),
  ferrite(['Slate', 1.25, 2.75, 120e3, [20e3, 150e3, 0.03, 0.3], [0.53, 0.43], 3000, 4850], [100, 0.8e-4]),
  powder(['Moss', 1.35, 2.0, 300e3, [10e3, 500e3, 0.01, 0.2], [1.0, 0.95], 60, 6000], [8000, 1.8], 155),
  powder(['Ochre', 1.2, 2.1, 800e3, [5e3, 300e3, 0.01, 0.3], [1.2, 1.1], 26, 6500], [16000, 1.6], 130),
];

/** Steinmetz k (W/m³, Hz, T) that makes k·f^α·B̂^β equal the anchor loss. */
export const kFromAnchor = (m: DemoMaterial) => m.anchorLoss / (m.anchorFrequency ** m.alpha * m.anchorPeakFlux ** m.beta);
