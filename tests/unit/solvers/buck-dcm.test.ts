import { describe, expect, it } from 'vitest';
import { buckWaveform } from '@shared/engine/buck-waveform';
import type { ConverterSpec } from '@shared/engine/inputs';
import { readSimulatedCurrent } from '../../../server/solvers/buck-bench.ts';
import { withSolverFolder } from '../../../server/solvers/solver-run.ts';

// The engine's discontinuous-conduction waveform checked against an independent circuit solver: ngspice (Debian
// package "ngspice") switches a buck at the engine's on-fraction D1 with a real rectifying diode (nearly ideal:
// emission coefficient 0.01, a few millivolts of drop), so the simulated current stops at zero by itself. If D1 were
// wrong for the load, the simulated average would not be the load current. Target: average and peak within 1 %.

const spec: ConverterSpec = { vinMin: 12, vinMax: 24, vout: 5, ioutMax: 4, frequency: 100e3, inductance: 20e-6, rectifier: 'ideal' };

function dcmNetlist(vin: number, onFraction: number, inductance: number, dataFile: string): string {
  const period = 1 / spec.frequency;
  const edge = 1e-11;
  const periods = 6;
  return [
    '* DCM buck with a rectifying diode (generated)',
    `Vin in 0 DC ${vin}`,
    'S1 in sw drive 0 high',
    'D1 0 sw nearideal',
    'Vsense sw lx DC 0',
    `L1 lx out ${inductance} IC=0`,
    `Vout out 0 DC ${spec.vout}`,
    `Vdrive drive 0 PULSE(0 1 0 ${edge} ${edge} ${(onFraction * period - edge).toPrecision(12)} ${period})`,
    '.model high SW(Ron=1e-6 Roff=1e7 Vt=0.5 Vh=0)',
    '.model nearideal D(IS=1e-14 N=0.01)',
    '.options reltol=1e-5',
    `.tran ${period / 1000} ${periods * period} ${(periods - 2) * period} ${period / 1000} UIC`,
    '.control',
    'set wr_singlescale',
    'set filetype=ascii',
    'run',
    `wrdata ${dataFile} i(Vsense)`,
    'quit 0',
    '.endc',
    '.end',
    '',
  ].join('\n');
}

describe('DCM waveform against ngspice (independent circuit simulation)', () => {
  for (const [vin, iout] of [
    [24, 0.3],
    [12, 0.5],
  ] as const) {
    it(`${vin} V in, ${iout} A load: average and peak within 1 %`, async () => {
      const w = buckWaveform(spec, vin, iout, 20e-6);
      expect(w.mode).toBe('dcm');
      const simulated = await withSolverFolder({ 'bench.cir': dcmNetlist(vin, w.rise, 20e-6, '{folder}/current.txt') }, async (folder) => {
        await folder.run({ program: 'ngspice', args: ['{folder}/bench.cir'], timeoutMs: 30_000, errorLine: /^\s*(error|fatal)\b/i });
        return readSimulatedCurrent(await folder.read('current.txt'), spec.frequency);
      });
      expect(simulated.average / iout).toBeCloseTo(1, 2);
      expect(Math.abs(simulated.peak / w.peak - 1)).toBeLessThan(0.01);
      // the current rests at zero (the diode blocks) for the part of the period the engine says
      const resting = simulated.lastPeriod.time.filter(
        (t, i) => t > (w.rise + w.fall) * 1e-5 * 1.02 && Math.abs(simulated.lastPeriod.current[i]!) < 0.01 * w.peak,
      );
      expect(resting.length).toBeGreaterThan(0);
    });
  }
});
