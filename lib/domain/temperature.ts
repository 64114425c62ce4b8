/**
 * The temperature rule for the deoxygenation rate (docs/MODEL.md §1): `constant`, one θ at
 * every temperature; `piecewise`, θ by temperature range.
 */
export const THETA_RULES = ["constant", "piecewise"] as const;
export type DeoxygenationThetaRule = (typeof THETA_RULES)[number];

export const DEFAULT_THETA_RULE: DeoxygenationThetaRule = "constant";

export const THETA_RULE_NAMES: Readonly<Record<DeoxygenationThetaRule, string>> = {
  constant: "One θ at every temperature",
  piecewise: "θ by temperature range (1.135 below 20 °C, 1.056 to 30 °C, 1.047 above)",
};
