import type { UnitSystem } from "@/lib/domain";
import { nameOf, OBJECTIVE_NAMES } from "@/lib/format/labels";
import { formatIn, formatPercent, unitLabel } from "@/lib/format/quantities";
import type { AllocationObjective } from "@/lib/model/types";

/** An objective's plain name ("Most total load"), or "model run only" for a run without an allocation. */
export const objectiveName = (objective: AllocationObjective | string | null | undefined): string =>
  objective === null || objective === undefined ? "model run only" : nameOf(OBJECTIVE_NAMES, objective);

/**
 * An allocation's objective value in words and the basin's units (what lib/model/allocation
 * report UNITS says it measures): loads in kg/d or lb/d; the equal-percent rule as a
 * percentage ("no reduction needed" when it rounds to zero, never "0.000 %"); the equal
 * effluent concentration in mg/L; the most-even share as a percentage of today's load.
 * "—" without a value. Example: ("equal-percent", 23.456) → "23.5 % reduction for every discharger".
 */
export function objectiveValueText(objective: AllocationObjective | string | null, value: number | null, units: string | null, system: UnitSystem): string {
  if (value === null || objective === null) return "—";
  switch (objective) {
    case "max-total":
    case "min-removal":
      return `${formatIn("load", value, system)} ${unitLabel("load", system)}${(units ?? "").replace(/^kg\/d/, "")}`;
    case "equal-percent":
      return Number(formatPercent(value)) === 0 ? "no reduction needed" : `${formatPercent(value)} % reduction for every discharger`;
    case "equal-concentration":
      return `${value.toFixed(1)} mg/L effluent CBODu for every discharger`;
    case "max-min-share":
      return `smallest allocation ${formatPercent(100 * value)} % of its load today`;
    default:
      return `${Number(value.toPrecision(4))} ${units ?? ""}`.trim();
  }
}
