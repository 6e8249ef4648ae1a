// The buck inductor's current over one period at any load: continuous (CCM), at the boundary, or discontinuous (DCM).
import { EngineInputError } from './errors';
import type { ConverterSpec } from './inputs';
import { intervalVoltages } from './operating-point';

export type ConductionMode = 'ccm' | 'boundary' | 'dcm';

/** Within this fraction of the boundary load the mode is called 'boundary'. */
const BOUNDARY_BAND = 0.01;

export interface BuckWaveform {
  mode: ConductionMode;
  /** Corners of the current over one period: times from the switch turning on (s, last = period) and current (A). */
  times: Float64Array;
  current: Float64Array;
  /** Rise and fall fractions of the period (D1, D2); in CCM D2 = 1 − D1, in DCM the current rests at zero for the rest. */
  rise: number;
  fall: number;
  peak: number;
  valley: number;
  /** Inductor voltage while the current rises and while it falls (V): the flux slopes are these over N·Ae. */
  onVoltage: number;
  offVoltage: number;
  /** Load below which this input voltage leaves CCM with this inductance (A). */
  boundaryCurrent: number;
}

/**
 * The current of a buck inductor L at input vin and load iout. The drops of the switch, rectifier and winding are
 * taken at the load current (intervalVoltages). CCM: D = Voff/(Von + Voff), ΔI = Von·D/(L·fs). Below the boundary
 * iout = ΔI/2 a diode (or ideal) rectifier stops the current at zero: from iout = Ipk·(D1 + D2)/2 with
 * Ipk = Von·D1/(L·fs) and D2 = D1·Von/Voff, D1 = √(2·L·fs·iout / (Von·(1 + Von/Voff))) (the standard DCM buck
 * relations, e.g. Erickson and Maksimović, Fundamentals of Power Electronics, 2nd ed., ch. 5). A synchronous
 * rectifier driven in forced PWM lets the current reverse instead, so it stays in CCM at every load; a controller
 * that emulates a diode behaves like the diode case.
 */
export function buckWaveform(spec: ConverterSpec, vin: number, iout: number, inductance: number): BuckWaveform {
  if (!(iout > 0)) throw new EngineInputError('ioutMax', `Load current must be above zero, got ${iout} A.`);
  if (!(inductance > 0)) throw new EngineInputError('inductance', `Inductance must be above zero, got ${inductance} H.`);
  const { on, off } = intervalVoltages(spec, vin, iout);
  if (!(on > 0 && off > 0)) throw new EngineInputError('vinMin', `At ${vin} V input the converter cannot regulate ${spec.vout} V.`);
  const fs = spec.frequency;
  const period = 1 / fs;
  const duty = off / (on + off);
  const ripple = (on * duty) / (inductance * fs);
  const boundaryCurrent = ripple / 2;
  const mode: ConductionMode =
    Math.abs(iout - boundaryCurrent) <= BOUNDARY_BAND * boundaryCurrent ? 'boundary' : iout > boundaryCurrent ? 'ccm' : 'dcm';
  if (mode !== 'dcm' || spec.rectifier === 'synchronous') {
    const valley = iout - ripple / 2;
    const peak = iout + ripple / 2;
    return {
      mode: spec.rectifier === 'synchronous' && mode === 'dcm' ? 'ccm' : mode,
      times: Float64Array.of(0, duty * period, period),
      current: Float64Array.of(valley, peak, valley),
      rise: duty,
      fall: 1 - duty,
      peak,
      valley,
      onVoltage: on,
      offVoltage: off,
      boundaryCurrent,
    };
  }
  const rise = Math.sqrt((2 * inductance * fs * iout) / (on * (1 + on / off)));
  const fall = (rise * on) / off;
  const peak = (on * rise) / (inductance * fs);
  return {
    mode,
    times: Float64Array.of(0, rise * period, (rise + fall) * period, period),
    current: Float64Array.of(0, peak, 0, 0),
    rise,
    fall,
    peak,
    valley: 0,
    onVoltage: on,
    offVoltage: off,
    boundaryCurrent,
  };
}

/**
 * The core's flux over the same corners (T) above its lowest value, from Faraday's law: slopes Von/(N·Ae) and
 * −Voff/(N·Ae), flat while the current rests at zero. The iGSE needs only these slopes and the swing.
 */
export function waveformFlux(waveform: BuckWaveform, turns: number, area: number): Float64Array {
  const period = waveform.times[waveform.times.length - 1]!;
  const swing = (waveform.onVoltage * waveform.rise * period) / (turns * area);
  const flux = new Float64Array(waveform.times.length);
  flux[1] = swing;
  return flux;
}
