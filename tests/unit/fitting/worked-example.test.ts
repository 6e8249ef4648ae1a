import { describe, expect, it } from 'vitest';
import { coreLossTemperatureFactor, steinmetzLoss } from '@shared/engine/core-loss';
import type { LossPoint } from '@shared/fitting/loss-points';
import { fitSteinmetz } from '@shared/fitting/steinmetz-fit';
import { behaviourFactor, fitTemperatureBehaviour, referToLowestLoss } from '@shared/fitting/temperature-fit';
import { relative } from './support';

// An invented material (no real grade): k referred to its lowest-loss temperature 90 °C, curvature 1.2e-4 /K².
const truth = { k: 4.1, alpha: 1.38, beta: 2.55 };
const behaviour = { lowestLossTemperature: 90, lowestLossFactor: 1, curvature: 1.2e-4 };
const loss = (frequency: number, peakFlux: number, temperature: number): LossPoint => ({
  frequency,
  peakFlux,
  temperature,
  lossDensity: steinmetzLoss(truth, frequency, peakFlux) * behaviourFactor(behaviour, temperature),
  source: 'invented',
});

describe('worked example: Steinmetz at 25 °C, then the temperature sweep, then k referred to T0 (the three fits in turn)', () => {
  const at25 = [30e3, 100e3, 300e3].flatMap((f) => [0.03, 0.1, 0.2].map((b) => loss(f, b, 25)));
  const sweep = [25, 50, 75, 100, 125].map((t) => loss(100e3, 0.1, t));

  it('recovers the invented material exactly, and the engine reproduces every point', () => {
    const steinmetz = fitSteinmetz(at25);
    // Fitted at 25 °C, k carries that temperature's factor; the sweep is measured relative to it.
    const temperature = fitTemperatureBehaviour(sweep, steinmetz);
    const referred = referToLowestLoss(steinmetz.k, temperature.behaviour);
    expect(relative(referred.k, truth.k)).toBeLessThan(1e-9);
    expect(Math.abs(referred.behaviour.lowestLossTemperature - 90)).toBeLessThan(1e-9);
    expect(relative(referred.behaviour.curvature, 1.2e-4)).toBeLessThan(1e-9);
    for (const p of [...at25, ...sweep]) {
      const predicted = steinmetzLoss(steinmetz, p.frequency, p.peakFlux) * coreLossTemperatureFactor(temperature.quadratic, p.temperature);
      expect(relative(predicted, p.lossDensity)).toBeLessThan(1e-9);
    }
  });
});
