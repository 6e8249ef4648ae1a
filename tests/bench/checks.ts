import { performance } from 'node:perf_hooks';
import { evaluateDesign } from '@shared/engine/index';
import type { ConverterSpec } from '@shared/engine/inputs';
import { CatalogueService } from '../../server/catalogue/catalogue.service.ts';
import { runCircuitCheck } from '../../server/checks/circuit-check.ts';
import { runFieldCheck } from '../../server/checks/field-check.ts';
import { ferriteA } from '../unit/engine/fixtures.ts';
import { runChecksUnderLoadBench } from './checks-under-load.ts';
import type { BenchRow } from './engine.ts';

const FIELD_TARGET_SECONDS = 30;

/**
 * The independent checks of one typical design (invented: 24–36 V → 12 V, 5 A, 100 kHz on a PQ32/30 with one layer of
 * 0.8 mm wire, the engine fixtures' invented ferrite), run as the worker runs them: the field check (magnetostatic +
 * fs, 2fs, 3fs) and the circuit check (three corners in ngspice).
 */
export async function runChecksBench(): Promise<BenchRow[]> {
  const catalogue = new CatalogueService();
  const spec: ConverterSpec = {
    vinMin: 24,
    vinMax: 36,
    vout: 12,
    ioutMax: 5,
    frequency: 100e3,
    rippleRatio: 0.3,
    rectifier: 'ideal',
    currentLimit: 6,
  };
  const core = catalogue.core('PQ32/30');
  const wire = catalogue.wire({ kind: 'metric', strandDiameter: 0.8e-3, strands: 1 });
  const evaluation = evaluateDesign({ spec, core, material: ferriteA, turns: 'auto', gap: 'auto', placement: 'ground', wire });
  const onProgress = async () => undefined;

  let started = performance.now();
  const field = await runFieldCheck({ evaluation, core, wire, permeability: ferriteA.permeability, title: 'bench' }, { onProgress });
  const fieldSeconds = (performance.now() - started) / 1000;
  started = performance.now();
  const circuit = await runCircuitCheck({ spec, evaluation });
  const circuitSeconds = (performance.now() - started) / 1000;
  return [
    {
      name: 'field check, typical design (static + 3 harmonics)',
      value: `${fieldSeconds.toFixed(1)} s, ${field.nodes.toLocaleString('en')} nodes — ${fieldSeconds <= FIELD_TARGET_SECONDS ? 'within' : 'over'} the ${FIELD_TARGET_SECONDS} s target`,
    },
    {
      name: 'circuit check, same design (ngspice)',
      value: `${circuitSeconds.toFixed(1)} s for ${circuit.corners.length} corners and the exported subcircuit (dissipation ${circuit.exportedModel?.differencePercent.dissipation.toFixed(2) ?? '—'} % from the engine's loss)`,
    },
    ...(await runChecksUnderLoadBench()),
  ];
}
