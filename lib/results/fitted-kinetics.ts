import { FIT_PARAMETER_NAMES } from "@/lib/domain";
import type { FittedKineticsSource } from "@/lib/validation/scenario";

const n = (v: number | null, digits: number) => (v === null || !Number.isFinite(v) ? "—" : v.toFixed(digits));
const sig = (v: number) => (Math.abs(v) >= 1 ? v.toFixed(3) : v.toPrecision(3));
const reachList = (ids: string[]) => (ids.length > 6 ? `${ids.length} reaches` : ids.join(", "));

/**
 * Where a scenario's fitted coefficients came from, in one line for methods sections (plan
 * page, PDF) and the scenario editor: each value with its standard error and reaches, the survey and
 * condition it was fitted on, the fit's statistics, and the check against a second survey.
 * Example: "Deoxygenation rate k_d at 20 °C (1/d) 0.412 ± 0.031 on TR-03, TR-04; fitted to
 * the survey “August 2026” (16 samples, SHA-256 077abc04d529031a…) on the condition
 * “12 August 2026”: RMSE 0.21 mg/L, mean error 0.01 mg/L, NSE 0.93; not checked against a second survey".
 */
export function fittedKineticsText(source: FittedKineticsSource): string {
  const values = source.parameters
    .map((p) => `${FIT_PARAMETER_NAMES[p.parameter]} ${sig(p.value)}${p.stdError !== null ? ` ± ${p.stdError.toPrecision(2)}` : " (standard error undefined)"} on ${reachList(p.reaches)}`)
    .join("; ");
  const fit = `fitted to the survey “${source.surveyName}” (${source.samples} samples, SHA-256 ${source.surveySha256.slice(0, 16)}…) on the condition “${source.condition}”: RMSE ${n(source.rmseMgL, 2)} mg/L, mean error ${n(source.biasMgL, 2)} mg/L, NSE ${n(source.nse, 2)}`;
  const check = source.validation
    ? `checked against “${source.validation.surveyName}” (${source.validation.samples} samples): RMSE ${n(source.validation.rmseMgL, 2)} mg/L, mean error ${n(source.validation.biasMgL, 2)} mg/L, NSE ${n(source.validation.nse, 2)}`
    : "not checked against a second survey";
  return `${source.name ? `“${source.name}”: ` : ""}${values}; ${fit}; ${check}`;
}

/** The line exports carry about the plan's coefficients: fitted to a survey (with the source), or as entered. */
export function kineticsLine(source: FittedKineticsSource | null | undefined): string {
  return source ? `Kinetics fitted to a survey: ${fittedKineticsText(source)}` : "Kinetics as entered (not calibrated in Sagline)";
}
