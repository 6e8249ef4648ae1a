/** How well a fit meets its points, from each point's (fitted − measured)/measured. */
export interface FitQuality {
  rmsRelativeError: number;
  worstRelativeError: number;
  /** Index of the point with the largest |relative error|. */
  worstPoint: number;
  pointCount: number;
}

/** Quality of fitted against measured values, index by index (both positive, same length, at least one). */
export function fitQuality(fitted: readonly number[], measured: readonly number[]): FitQuality {
  let sumSquares = 0;
  let worst = -1;
  let worstPoint = 0;
  measured.forEach((value, i) => {
    const error = fitted[i]! / value - 1;
    sumSquares += error * error;
    if (Math.abs(error) > worst) {
      worst = Math.abs(error);
      worstPoint = i;
    }
  });
  return { rmsRelativeError: Math.sqrt(sumSquares / measured.length), worstRelativeError: worst, worstPoint, pointCount: measured.length };
}
