/** Permeability of free space (H/m). */
export const MU0 = 4e-7 * Math.PI;

/** Annealed copper resistivity at 20 °C (Ω·m), IEC 60028. */
export const COPPER_RESISTIVITY_20C = 1.7241e-8;

/** Temperature coefficient of copper resistance at 20 °C (1/K). */
export const COPPER_TEMPERATURE_COEFFICIENT = 0.00393;

/** Hot spot inside the winding above the predicted surface temperature (K); common practice, no source. */
export const HOT_SPOT_ALLOWANCE = 5;

/** Above this lg/√Ae the empirical fringing factor is outside its range of validity. */
export const FRINGING_VALIDITY_LIMIT = 0.3;

/** Density of copper (kg/m³), IEC 60028 (8,890 kg/m³ at 20 °C). */
export const COPPER_DENSITY = 8890;
