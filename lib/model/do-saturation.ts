import { requireFinite, requireNonNegative } from "./errors";

/**
 * Atmospheric pressure (atm) at elevation z (m) from the standard atmosphere:
 * P/P0 = (1 − 2.25577×10⁻⁵·z)^5.25588. Valid from below sea level to ~11 km; throws
 * above 44 000 m where the base turns negative.
 * Example: `pressureAtElevationAtm(1000)` → 0.8870…
 */
export function pressureAtElevationAtm(elevation_m: number): number {
  requireFinite(elevation_m, ["elevation_m"]);
  const base = 1 - 2.25577e-5 * elevation_m;
  if (base <= 0) throw new RangeError(`elevation_m ${elevation_m} is outside the standard atmosphere`);
  return Math.pow(base, 5.25588);
}

/**
 * Saturation DO (mg/L) in water at `t_c` °C, salinity `salinity_g_kg` (‰) and pressure
 * `pressure_atm`, by Benson & Krause (1984) as given in APHA Standard Methods 4500-O:
 *   ln C* = −139.34411 + 1.575701e5/T − 6.642308e7/T² + 1.243800e10/T³ − 8.621949e11/T⁴
 *           − S·(1.7674e−2 − 1.0754e1/T + 2.1407e3/T²)
 *   C_p   = C*·P·(1 − P_wv/P)(1 − θ·P) / ((1 − P_wv)(1 − θ))
 *   ln P_wv = 11.8571 − 3840.70/T − 216961/T²,  θ = 0.000975 − 1.426e−5·t + 6.436e−8·t²
 * with T in K. Valid 0–40 °C, 0–40 ‰, 0.5–1.1 atm (the published range of the fit);
 * throws outside 0–50 °C or on negative salinity/pressure.
 * Example: `doSaturationMgL({ t_c: 20 })` → 9.092 (Standard Methods table).
 */
export function doSaturationMgL(o: { t_c: number; salinity_g_kg?: number; pressure_atm?: number }): number {
  const t = requireFinite(o.t_c, ["temperature_c"]);
  if (t < 0 || t > 50) throw new RangeError(`temperature_c ${t} is outside 0–50 °C for DO saturation`);
  const s = requireNonNegative(o.salinity_g_kg ?? 0, ["salinity_g_kg"]);
  const p = o.pressure_atm ?? 1;
  requireNonNegative(p, ["pressure_atm"]);
  const T = t + 273.15;
  const lnC =
    -139.34411 + 1.575701e5 / T - 6.642308e7 / T ** 2 + 1.2438e10 / T ** 3 - 8.621949e11 / T ** 4 -
    s * (1.7674e-2 - 1.0754e1 / T + 2.1407e3 / T ** 2);
  const c1 = Math.exp(lnC);
  if (p === 1) return c1;
  const pwv = Math.exp(11.8571 - 3840.7 / T - 216961 / T ** 2);
  const theta = 0.000975 - 1.426e-5 * t + 6.436e-8 * t * t;
  return (c1 * p * (1 - pwv / p) * (1 - theta * p)) / ((1 - pwv) * (1 - theta));
}

/** Saturation DO (mg/L) at temperature, elevation (m) and salinity; see doSaturationMgL. */
export function doSaturationAtElevation(t_c: number, elevation_m = 0, salinity_g_kg = 0): number {
  return doSaturationMgL({ t_c, salinity_g_kg, pressure_atm: pressureAtElevationAtm(elevation_m) });
}
