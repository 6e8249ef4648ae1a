// Invented points and a fit answer shaped as the fit route answers, for the specs of the loss-points page.
import type { LossPoint } from '@shared/fitting/loss-points';
import type { FitAnswer } from '@shared/schemas/loss-points';

export const POINTS: LossPoint[] = [
  { frequency: 100e3, peakFlux: 0.05, temperature: 25, lossDensity: 20e3, source: 'bench A' },
  { frequency: 100e3, peakFlux: 0.1, temperature: 25, lossDensity: 90e3 },
  { frequency: 200e3, peakFlux: 0.05, temperature: 25, lossDensity: 50e3, dcBias: 30 },
];

export const FIT: FitAnswer = {
  materialId: 7,
  options: { mode: 'whole', maxWorstError: 0.1, temperature: true },
  pointCount: 3,
  fits: [
    {
      k: 3.25,
      alpha: 1.42,
      beta: 2.51,
      fittedFrequency: [100e3, 200e3],
      fittedFlux: [0.05, 0.1],
      rmsRelativeError: 0.0412,
      worstRelativeError: 0.08,
      worstPoint: 1,
      pointCount: 3,
      pointIndices: [0, 1, 2],
      meetsTarget: true,
    },
  ],
  temperature: {
    lowestLossTemperature: 92.5,
    lowestLossFactor: 1,
    curvature: 1.2e-4,
    quadratic: { ct0: 2.03, ct1: 0.0222, ct2: 1.2e-4 },
    fittedTemperature: [25, 120],
    rmsRelativeError: 0.03,
    worstRelativeError: 0.06,
    worstPoint: 0,
    pointCount: 3,
    constrained: false,
  },
  biasLoss: null,
  residuals: [
    { index: 0, band: 0, measured: 20e3, fitted: 21e3, relativeError: 0.05 },
    { index: 1, band: 0, measured: 90e3, fitted: 82e3, relativeError: -0.08 },
    { index: 2, band: 0, measured: 50e3, fitted: 51e3, relativeError: 0.02 },
  ],
  curves: [
    {
      band: 0,
      frequency: 100e3,
      temperature: 25,
      samples: [
        { peakFlux: 0.05, lossDensity: 21e3 },
        { peakFlux: 0.1, lossDensity: 82e3 },
      ],
    },
    {
      band: 0,
      frequency: 200e3,
      temperature: 25,
      samples: [
        { peakFlux: 0.05, lossDensity: 51e3 },
        { peakFlux: 0.1, lossDensity: 200e3 },
      ],
    },
  ],
  curvesTruncated: false,
};
