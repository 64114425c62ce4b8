/** The kinetic coefficients a calibration may fit (lib/calibration/calibrate.ts). */
export const FIT_PARAMETERS = ["kd20_per_day", "ka_multiplier", "sod20_g_m2_day", "ks20_per_day"] as const;
export type FitParameter = (typeof FIT_PARAMETERS)[number];

export const FIT_PARAMETER_NAMES: Readonly<Record<FitParameter, string>> = {
  kd20_per_day: "Deoxygenation rate k_d at 20 °C (1/d)",
  ka_multiplier: "Reaeration multiplier (× the reach's k_a)",
  sod20_g_m2_day: "Sediment oxygen demand at 20 °C (g/m²/d)",
  ks20_per_day: "BOD settling rate k_s at 20 °C (1/d)",
};

/**
 * The bounds and start the calibration form offers for each coefficient: wide ranges of the
 * values reported for streams (common practice, not a standard); the planner narrows them.
 */
export const FIT_DEFAULTS: Readonly<Record<FitParameter, { min: number; max: number; start: number }>> = {
  kd20_per_day: { min: 0.05, max: 3, start: 0.3 },
  ka_multiplier: { min: 0.2, max: 5, start: 1 },
  sod20_g_m2_day: { min: 0, max: 10, start: 0.5 },
  ks20_per_day: { min: 0, max: 2, start: 0.1 },
};
