// Inputs every engine entry point shares. SI units; temperatures in °C.
import type { GapPlacement } from './types';

export type Rectifier = 'ideal' | 'diode' | 'synchronous';

/** A buck converter in continuous conduction. Give exactly one of rippleRatio, rippleCurrent or inductance. */
export interface ConverterSpec {
  vinMin: number;
  vinNom?: number;
  vinMax: number;
  vout: number;
  ioutMax: number;
  ioutMin?: number;
  frequency: number;
  /** Peak-to-peak ripple over full-load current, at Vin max. */
  rippleRatio?: number;
  /** Peak-to-peak ripple current (A), at Vin max. */
  rippleCurrent?: number;
  /** Required (minimum) inductance (H). */
  inductance?: number;
  rectifier: Rectifier;
  /** Diode forward drop (V), non-synchronous rectifier. */
  diodeDrop?: number;
  /** High-side switch drop (V), non-synchronous rectifier. */
  switchDrop?: number;
  highSideResistance?: number;
  lowSideResistance?: number;
  inductorResistance?: number;
  /** Controller current limit (A); the saturation check uses the larger of this and the ripple peak. */
  currentLimit?: number;
}

/** What the search ranks by: the smallest part meeting every limit, lowest loss, lowest temperature rise, or loss × volume. */
export type RankBy = 'smallest' | 'loss' | 'temperature' | 'balanced';

export interface DesignLimits {
  ambient: number;
  /** Speed of a forced air stream along the part (m/s); 0 = natural convection only. */
  airSpeed: number;
  /** Thermal resistance from the core to the board (K/W); absent = the part stands free in air. */
  boardThermalResistance?: number;
  maxRise: number;
  lossBudget?: number;
  inductanceTolerance: number;
  bMax: number;
  saturationMargin: number;
  currentDensity: number;
  windowUtilisation: number;
  insulationClass: number;
  maxStrands: number;
  /** Smallest allowed L(Ipk)/L0 of a powder core. */
  minPermeabilityAtPeak: number;
  /** Smallest ground gap or spacer a workshop can hold (m); distributed-gap cores are exempt. */
  minGap: number;
  /**
   * Clearance from the centre-leg face to the first layer's copper (m). The bobbin height is the build available at
   * the default (the bobbin wall); a larger keep-out takes its excess from the build and lowers the gap-field loss.
   * The search may use more than this when it lowers the total loss.
   */
  keepOut: number;
  /** Gap placements the search may propose for air-gap cores (default both); a shop that cannot grind excludes 'ground'. */
  gapPlacements?: readonly GapPlacement[];
  allowedFamilies?: readonly string[];
  allowedMaterials?: readonly string[];
}

/** A bobbin wall is about 0.5 mm thick (common practice, no source); the field model's default clearance too. */
export const DEFAULT_KEEP_OUT = 0.5e-3;

export const DEFAULT_LIMITS: DesignLimits = {
  ambient: 40,
  airSpeed: 0,
  maxRise: 50,
  inductanceTolerance: 0.1,
  bMax: 0.3,
  saturationMargin: 0.2,
  currentDensity: 4e6,
  windowUtilisation: 0.4,
  insulationClass: 130,
  maxStrands: 8,
  minPermeabilityAtPeak: 0.5,
  // Below about 50 µm a ground gap is lost in grinding tolerance and mating-face roughness (common practice, no source).
  minGap: 50e-6,
  keepOut: DEFAULT_KEEP_OUT,
};

export function resolveLimits(limits: Partial<DesignLimits> | undefined): DesignLimits {
  const resolved: DesignLimits = { ...DEFAULT_LIMITS };
  if (!limits) return resolved;
  for (const [key, value] of Object.entries(limits)) {
    if (value !== undefined) (resolved as unknown as Record<string, unknown>)[key] = value;
  }
  return resolved;
}

export type IssueSeverity = 'error' | 'warning';

export interface EngineIssue {
  code: string;
  severity: IssueSeverity;
  message: string;
}
