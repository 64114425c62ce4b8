import type { DeoxygenationThetaRule } from "@/lib/domain";
import { ModelInputError, requireFinite, requirePositive } from "./errors";

/**
 * Default Arrhenius θ per process. Sources: deoxygenation 1.047, SOD 1.065, nitrification
 * 1.08 (Chapra, "Surface Water-Quality Modeling", 1997; Thomann & Mueller, "Principles of
 * Surface Water Quality Modeling and Control", 1987); reaeration 1.024 (Elmore & West 1961).
 * Settling is not temperature-corrected by default (θ = 1), a modelling choice.
 */
export const DEFAULT_THETA = {
  deoxygenation: 1.047,
  reaeration: 1.024,
  sod: 1.065,
  nitrification: 1.08,
  settling: 1.0,
} as const;


/** `constant`: k_d uses θ_deoxygenation at every temperature; `piecewise`: see deoxygenationTheta (the rules: lib/domain). */
export type { DeoxygenationThetaRule };

/**
 * Rate at temperature T from its 20 °C value: k_T = k_20 · θ^(T − 20).
 * Source: the Arrhenius-type form used throughout (e.g. Chapra 1997, eq. 2.44).
 * Valid for ordinary river temperatures (0–40 °C); throws when θ ≤ 0 or inputs are not finite.
 * Example: `rateAtTemperature(0.35, 1.047, 25)` → 0.4404…
 */
export function rateAtTemperature(k20: number, theta: number, t_c: number): number {
  requireFinite(k20, ["k20_per_day"]);
  requirePositive(theta, ["theta"]);
  requireFinite(t_c, ["temperature_c"]);
  return k20 * Math.pow(theta, t_c - 20);
}

/**
 * θ for deoxygenation under the piecewise rule used in practice: 1.135 below 20 °C,
 * 1.056 from 20 to 30 °C, 1.047 above 30 °C (common practice; the 1.135/1.056 pair is
 * usually traced to Schroepfer et al. 1964). Under `constant` returns `constantTheta`.
 * Example: `deoxygenationTheta(15, "piecewise")` → 1.135.
 */
export function deoxygenationTheta(
  t_c: number,
  rule: DeoxygenationThetaRule,
  constantTheta: number = DEFAULT_THETA.deoxygenation,
): number {
  requireFinite(t_c, ["temperature_c"]);
  if (rule === "constant") return constantTheta;
  if (rule !== "piecewise") throw new ModelInputError(["kinetics", "deoxygenation_rule"], `unknown rule "${String(rule)}"`);
  if (t_c < 20) return 1.135;
  if (t_c <= 30) return 1.056;
  return 1.047;
}
