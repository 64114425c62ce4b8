/**
 * How a reach's velocity and depth are found at its flow (MODEL.md §3): given as numbers
 * (the same at any flow), hydraulic geometry (U = a·Q^b, H = c·Q^f) or Manning's equation
 * at normal depth. Each run records the rule per segment.
 */
export const HYDRAULICS_RULES = ["given", "hydraulic-geometry", "manning"] as const;
export type HydraulicsRule = (typeof HYDRAULICS_RULES)[number];

export const HYDRAULICS_RULE_NAMES: Readonly<Record<HydraulicsRule, string>> = {
  given: "velocity and depth as given (the same at any flow)",
  "hydraulic-geometry": "hydraulic geometry (U = a·Q^b, H = c·Q^f)",
  manning: "Manning's equation at normal depth",
};

/** The same, short, for a table cell. */
export const HYDRAULICS_RULE_SHORT: Readonly<Record<HydraulicsRule, string>> = { given: "as given", "hydraulic-geometry": "hydraulic geometry", manning: "Manning" };
