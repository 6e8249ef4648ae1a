import { EngineInputError } from './errors';
import type { ConverterSpec, EngineIssue } from './inputs';

export interface OperatingPoint {
  frequency: number;
  vout: number;
  ioutMax: number;
  ioutMin: number;
  /** Duty cycle at Vin max (ripple and core loss are worst there) and at Vin min. */
  dutyAtVinMax: number;
  dutyAtVinMin: number;
  /** Inductor voltage during the on-interval at Vin max (V); ΔB·N·Ae = onVoltage·D/fs. */
  onVoltageAtVinMax: number;
  /** Volt-seconds applied during the on-interval at Vin max (V·s). */
  voltSeconds: number;
  /** Required (minimum) inductance and the nominal value to build so the low-tolerance part still meets it (H). */
  inductanceMin: number;
  inductanceNominal: number;
  /** Peak-to-peak ripple with the minimum inductance (A). */
  rippleAtVinMax: number;
  rippleAtVinMin: number;
  rippleRatio: number;
  peakCurrent: number;
  valleyCurrent: number;
  rmsCurrent: number;
  /** ½·L·Ipk² with the minimum inductance (J). */
  storedEnergy: number;
  /** Load current below which the converter enters DCM at Vin max (A). */
  ccmBoundaryCurrent: number;
  /** Peak current used for the saturation check: max(Ipk, current limit) (A). */
  saturationCheckCurrent: number;
  warnings: EngineIssue[];
}

interface Drops {
  /** Voltage lost across the high-side switch at load current I. */
  switchDrop: number;
  /** Voltage across the freewheeling element (diode drop, or −I·Rls·… as a positive loss). */
  freewheelDrop: number;
  inductorDrop: number;
}

function drops(spec: ConverterSpec, current: number): Drops {
  const inductorDrop = current * (spec.inductorResistance ?? 0);
  switch (spec.rectifier) {
    case 'ideal':
      return { switchDrop: 0, freewheelDrop: 0, inductorDrop: 0 };
    case 'diode':
      return { switchDrop: spec.switchDrop ?? 0, freewheelDrop: spec.diodeDrop ?? 0, inductorDrop };
    case 'synchronous':
      return {
        switchDrop: current * (spec.highSideResistance ?? 0),
        freewheelDrop: current * (spec.lowSideResistance ?? 0),
        inductorDrop,
      };
  }
}

/** Inductor voltage during the on- and off-intervals; volt-second balance gives D = off/(on + off). */
export function intervalVoltages(spec: ConverterSpec, vin: number, current: number): { on: number; off: number } {
  const d = drops(spec, current);
  return {
    on: vin - d.switchDrop - spec.vout - d.inductorDrop,
    off: spec.vout + d.freewheelDrop + d.inductorDrop,
  };
}

export function dutyCycle(spec: ConverterSpec, vin: number, current: number): number {
  const { on, off } = intervalVoltages(spec, vin, current);
  return off / (on + off);
}

function checkDuty(duty: number, vin: number, field: string): void {
  if (!(duty > 0 && duty < 1) || !Number.isFinite(duty)) {
    throw new EngineInputError(
      field,
      `Duty cycle at ${vin} V input is ${duty.toFixed(3)}, outside 0…1: the converter cannot regulate there.`,
    );
  }
}

function requiredInductance(spec: ConverterSpec, onVoltage: number, duty: number): number {
  if (spec.inductance !== undefined) return spec.inductance;
  const ripple = spec.rippleCurrent ?? (spec.rippleRatio ?? Number.NaN) * spec.ioutMax;
  if (!(ripple > 0)) {
    throw new EngineInputError('rippleRatio', 'Give a ripple ratio, a ripple current or an inductance.');
  }
  return (onVoltage * duty) / (spec.frequency * ripple);
}

function inductanceField(spec: ConverterSpec): string {
  if (spec.inductance !== undefined) return 'inductance';
  return spec.rippleCurrent !== undefined ? 'rippleCurrent' : 'rippleRatio';
}

/**
 * Buck CCM operating point. The inductance from the ripple target is the minimum that must be reached
 * over tolerance; the nominal value is L/(1 − tolerance).
 */
export function operatingPoint(spec: ConverterSpec, inductanceTolerance = 0.1): OperatingPoint {
  if (spec.vout >= spec.vinMin) {
    throw new EngineInputError(
      'vout',
      `Output voltage ${spec.vout} V must be below the minimum input voltage ${spec.vinMin} V for a buck converter.`,
    );
  }
  if (spec.vinMin > spec.vinMax) {
    throw new EngineInputError('vinMin', `Minimum input ${spec.vinMin} V exceeds maximum input ${spec.vinMax} V.`);
  }
  if (!(inductanceTolerance >= 0 && inductanceTolerance < 1)) {
    throw new EngineInputError('inductanceTolerance', 'Inductance tolerance must be between 0 and 1.');
  }
  const iout = spec.ioutMax;
  const ioutMin = spec.ioutMin ?? 0;
  const fs = spec.frequency;

  const high = intervalVoltages(spec, spec.vinMax, iout);
  const low = intervalVoltages(spec, spec.vinMin, iout);
  const dutyAtVinMax = high.off / (high.on + high.off);
  const dutyAtVinMin = low.off / (low.on + low.off);
  checkDuty(dutyAtVinMax, spec.vinMax, 'vinMax');
  checkDuty(dutyAtVinMin, spec.vinMin, 'vinMin');

  const inductanceMin = requiredInductance(spec, high.on, dutyAtVinMax);
  const rippleAtVinMax = (high.on * dutyAtVinMax) / (fs * inductanceMin);
  const rippleAtVinMin = (low.on * dutyAtVinMin) / (fs * inductanceMin);
  const worstRipple = Math.max(rippleAtVinMax, rippleAtVinMin);

  if (iout <= worstRipple / 2) {
    throw new EngineInputError(
      inductanceField(spec),
      `Ripple ${worstRipple.toFixed(3)} A peak-to-peak reaches zero current at full load ${iout} A ` +
        '(discontinuous conduction): raise the inductance or lower the ripple.',
    );
  }
  const warnings: EngineIssue[] = [];
  const ccmBoundaryCurrent = worstRipple / 2;
  if (ioutMin > 0 && ioutMin < ccmBoundaryCurrent) {
    warnings.push({
      code: 'dcm-at-min-load',
      severity: 'warning',
      message: `At the minimum load ${ioutMin} A the converter runs in discontinuous conduction (boundary ${ccmBoundaryCurrent.toFixed(2)} A).`,
    });
  }

  const peakCurrent = iout + worstRipple / 2;
  return {
    frequency: fs,
    vout: spec.vout,
    ioutMax: iout,
    ioutMin,
    dutyAtVinMax,
    dutyAtVinMin,
    onVoltageAtVinMax: high.on,
    voltSeconds: (high.on * dutyAtVinMax) / fs,
    inductanceMin,
    inductanceNominal: inductanceMin / (1 - inductanceTolerance),
    rippleAtVinMax,
    rippleAtVinMin,
    rippleRatio: worstRipple / iout,
    peakCurrent,
    valleyCurrent: iout - worstRipple / 2,
    rmsCurrent: Math.sqrt(iout * iout + (worstRipple * worstRipple) / 12),
    storedEnergy: 0.5 * inductanceMin * peakCurrent * peakCurrent,
    ccmBoundaryCurrent,
    saturationCheckCurrent: Math.max(peakCurrent, spec.currentLimit ?? 0),
    warnings,
  };
}
