/** What an allocation optimises (docs/MODEL.md §6). */
export const ALLOCATION_OBJECTIVES = ["max-total", "min-removal", "equal-percent", "equal-concentration", "max-min-share"] as const;
export type AllocationObjective = (typeof ALLOCATION_OBJECTIVES)[number];

export const DEFAULT_OBJECTIVE: AllocationObjective = "max-total";

/** Objectives whose value is a load (kg/d): their shadow prices are DO per load. */
export const LOAD_OBJECTIVES = ["max-total", "min-removal"] as const satisfies readonly AllocationObjective[];

/** The objectives solved by one common rule (one free variable) rather than as a linear programme. */
export const ONE_RULE_OBJECTIVES = ["equal-percent", "equal-concentration"] as const satisfies readonly AllocationObjective[];
export type OneRuleObjective = (typeof ONE_RULE_OBJECTIVES)[number];

export const isLoadObjective = (o: AllocationObjective): o is (typeof LOAD_OBJECTIVES)[number] => (LOAD_OBJECTIVES as readonly string[]).includes(o);
export const isOneRuleObjective = (o: AllocationObjective): o is OneRuleObjective => (ONE_RULE_OBJECTIVES as readonly string[]).includes(o);

/** Plain-word names of the objectives, shared by the scenario editor, results and reports. */
export const OBJECTIVE_NAMES: Readonly<Record<AllocationObjective, string>> = {
  "max-total": "Most total load",
  "min-removal": "Least total removal",
  "equal-percent": "Equal percent removal",
  "equal-concentration": "Equal effluent concentration",
  "max-min-share": "Most even share",
};
