import type { UnitSystem } from "@/lib/domain";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import type { ConditionInputs } from "@/lib/validation/scenario";

/**
 * Where a condition's design flows came from, in words, for plans, reports and comparisons:
 * a gauge's statistic (with the record it was read from) or the outlet flow entered — every
 * reach's network design flow is then scaled to match — or the network's design low flows
 * times the condition's scale.
 * Example: "7Q10 of Tamsel River at Quillford (TQ-0410): 0.441 m³/s at TR-04, 30 years of daily record 1994-04-01 to 2024-03-31".
 */
export function conditionFlowText(c: Pick<ConditionInputs, "flowScale" | "outletFlowM3s" | "gaugeFlow">, system: UnitSystem): string {
  const flow = (q: number) => `${formatIn("flow", q, system)} ${unitLabel("flow", system)}`;
  const source = c.gaugeFlow?.source;
  if (c.gaugeFlow && source) {
    const gauged = `${c.gaugeFlow.statistic} of ${source.gaugeName}${source.stationCode ? ` (${source.stationCode})` : ""}: ${flow(source.valueM3s)} at ${source.reachId}, ${source.yearsUsed} years of daily record ${source.firstDay} to ${source.lastDay}`;
    const t = source.transfers;
    if (!t) return gauged;
    const area = (a: number) => `${formatIn("area", a, system)} ${unitLabel("area", system)}`;
    const heads = t.headwaters.map((h) => `${h.reach} ${flow(h.flowM3s)} (${area(h.areaKm2)})`).join(", ");
    return (
      `${gauged}; carried to headwaters by drainage-area ratio, Q × (A / ${area(t.gaugeAreaKm2)})${t.exponent === 1 ? "" : `^${t.exponent}`}: ${heads || "none had a drainage area"}` +
      (t.scaled.length ? `; scaled with every reach (no drainage area): ${t.scaled.join(", ")}` : "")
    );
  }
  if (c.outletFlowM3s != null) return `design flow at the outlet ${flow(c.outletFlowM3s)}`;
  return `network design low flow × ${c.flowScale}`;
}
