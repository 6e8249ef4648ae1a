import type { MaterialFamily } from '@shared/engine/types';

/**
 * Invented, illustrative core materials for the demo. They are not any maker's grade: each k is
 * chosen so the material loses a round, plausible amount at one stated point (common practice, no
 * source: MnZn power ferrite loses of order 50–150 kW/m³ at 100 kHz and 0.1 T peak near its
 * loss minimum; powder cores lose more at the same flux), with α and β inside the generic MnZn ranges
 * α ≈ 1.1–1.9, β ≈ 2.2–3.0 (common practice, no source). Temperature curves follow the usual parabolic
 * correction ct2·T² − ct1·T + ct0 (common practice, no source) with the minimum near 80–100 °C.
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
  /** Temperature of minimum loss (°C) and curvature ct2 (1/K²); omitted for powders. */
  minimumLossAt?: { temperature: number; ct2: number };
  bsat25: number;
  bsat100: number;
  permeability: number;
  /** Powder DC-bias roll-off as μ% = 1/(1 + (H/H50)^c), H in A/m. */
  rollOff?: { h50: number; c: number };
  density: number;
}

export const DEMO_MATERIALS: readonly DemoMaterial[] = [
  {
    name: 'Demo ferrite MF-95 (illustrative)',
    family: 'ferrite',
    alpha: 1.4,
    beta: 2.65,
    anchorLoss: 80e3,
    anchorFrequency: 100e3,
    anchorPeakFlux: 0.1,
    fit: { fMin: 50e3, fMax: 300e3, bMin: 0.02, bMax: 0.25 },
    minimumLossAt: { temperature: 90, ct2: 1.0e-4 },
    bsat25: 0.5,
    bsat100: 0.4,
    permeability: 2300,
    density: 4800,
  },
  {
    name: 'Demo ferrite MF-140 (illustrative)',
    family: 'ferrite',
    alpha: 1.55,
    beta: 2.55,
    anchorLoss: 60e3,
    anchorFrequency: 100e3,
    anchorPeakFlux: 0.1,
    fit: { fMin: 100e3, fMax: 1e6, bMin: 0.01, bMax: 0.15 },
    minimumLossAt: { temperature: 80, ct2: 1.2e-4 },
    bsat25: 0.48,
    bsat100: 0.38,
    permeability: 1400,
    density: 4800,
  },
  {
    name: 'Demo ferrite MF-60 (illustrative)',
    family: 'ferrite',
    alpha: 1.25,
    beta: 2.75,
    anchorLoss: 120e3,
    anchorFrequency: 100e3,
    anchorPeakFlux: 0.1,
    fit: { fMin: 20e3, fMax: 150e3, bMin: 0.03, bMax: 0.3 },
    minimumLossAt: { temperature: 100, ct2: 0.8e-4 },
    bsat25: 0.53,
    bsat100: 0.43,
    permeability: 3000,
    density: 4850,
  },
  {
    name: 'Demo powder P-60 (illustrative)',
    family: 'powder',
    alpha: 1.35,
    beta: 2.0,
    anchorLoss: 300e3,
    anchorFrequency: 100e3,
    anchorPeakFlux: 0.05,
    fit: { fMin: 10e3, fMax: 500e3, bMin: 0.01, bMax: 0.2 },
    bsat25: 1.0,
    bsat100: 0.95,
    permeability: 60,
    rollOff: { h50: 8000, c: 1.8 },
    density: 6000,
  },
  {
    name: 'Demo powder P-26 (illustrative)',
    family: 'powder',
    alpha: 1.2,
    beta: 2.1,
    anchorLoss: 800e3,
    anchorFrequency: 100e3,
    anchorPeakFlux: 0.05,
    fit: { fMin: 5e3, fMax: 300e3, bMin: 0.01, bMax: 0.3 },
    bsat25: 1.2,
    bsat100: 1.1,
    permeability: 26,
    rollOff: { h50: 16000, c: 1.6 },
    density: 6500,
  },
];

/** Steinmetz k (W/m³, Hz, T) that makes k·f^α·B̂^β equal the anchor loss. */
export const kFromAnchor = (m: DemoMaterial) => m.anchorLoss / (m.anchorFrequency ** m.alpha * m.anchorPeakFlux ** m.beta);
