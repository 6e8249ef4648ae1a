// The physical quantities the forms ask for: how each is checked, stored (SI) and shown.

export const QUANTITY_KINDS = [
  'voltage',
  'current',
  'frequency',
  'inductance',
  'resistance',
  'temperature',
  'temperatureRise',
  'power',
  'fluxDensity',
  'currentDensity',
  'length',
  'speed',
  'thermalResistance',
  'ratio',
  'count',
] as const;
export type QuantityKind = (typeof QUANTITY_KINDS)[number];

export interface QuantityInfo {
  /** How an error names what was expected, e.g. "a voltage (V)". */
  expected: string;
  /** A unit of the right dimension, for the dimension check (mathjs spelling); empty for plain numbers. */
  reference: string;
  /** Symbol shown after the number. */
  symbol: string;
  /** Displayed number = SI value × displayScale (A/m² is shown as A/mm²). */
  displayScale: number;
  /** Whether SI prefixes are used when showing the value. */
  prefixed: boolean;
}

export const QUANTITIES: Record<QuantityKind, QuantityInfo> = {
  voltage: { expected: 'a voltage (V)', reference: 'V', symbol: 'V', displayScale: 1, prefixed: true },
  current: { expected: 'a current (A)', reference: 'A', symbol: 'A', displayScale: 1, prefixed: true },
  frequency: { expected: 'a frequency (Hz)', reference: 'Hz', symbol: 'Hz', displayScale: 1, prefixed: true },
  inductance: { expected: 'an inductance (H)', reference: 'H', symbol: 'H', displayScale: 1, prefixed: true },
  resistance: { expected: 'a resistance (Ω)', reference: 'ohm', symbol: 'Ω', displayScale: 1, prefixed: true },
  temperature: { expected: 'a temperature (°C)', reference: 'degC', symbol: '°C', displayScale: 1, prefixed: false },
  temperatureRise: { expected: 'a temperature rise (K)', reference: 'K', symbol: 'K', displayScale: 1, prefixed: false },
  power: { expected: 'a power (W)', reference: 'W', symbol: 'W', displayScale: 1, prefixed: true },
  fluxDensity: { expected: 'a flux density (T)', reference: 'T', symbol: 'T', displayScale: 1, prefixed: true },
  currentDensity: { expected: 'a current density (A/mm²)', reference: 'A/m^2', symbol: 'A/mm²', displayScale: 1e-6, prefixed: false },
  length: { expected: 'a length (m)', reference: 'm', symbol: 'm', displayScale: 1, prefixed: true },
  speed: { expected: 'a speed (m/s)', reference: 'm/s', symbol: 'm/s', displayScale: 1, prefixed: false },
  thermalResistance: { expected: 'a thermal resistance (K/W)', reference: 'K/W', symbol: 'K/W', displayScale: 1, prefixed: false },
  ratio: { expected: 'a plain number or a percentage', reference: '', symbol: '', displayScale: 1, prefixed: false },
  count: { expected: 'a whole number', reference: '', symbol: '', displayScale: 1, prefixed: false },
};
