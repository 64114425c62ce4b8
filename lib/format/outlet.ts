import type { NetworkPart } from "@/geo";

const km = (x: number) => `${x.toFixed(2)} km`;

/**
 * One sentence naming a part's outlet and how it was found, for the import report:
 * "Outlet: the downstream end of M3, from the line directions (0.89 km of 4.23 km turned
 * round; next best, the free end of T4, would turn 2.22 km)."
 */
export function outletSentence(part: NetworkPart, partCount = 1): string {
  const which = partCount > 1 ? `Outlet of part ${part.index + 1}` : "Outlet";
  const where = `${which}: the downstream end of ${part.outletReachId}`;
  if (part.chosen) return `${where}, as you chose.`;
  const s = part.suggestion;
  if (s.basis === "field") return `${where}, from the downstream-id field.`;
  const next =
    s.runnerUpReachId !== undefined && s.runnerUpTurnedKm !== undefined
      ? `; next best, the free end of ${s.runnerUpReachId}, would turn ${km(s.runnerUpTurnedKm)}`
      : "";
  const sure = s.weak ? " This is uncertain: choose the outlet under Outlet and check again." : "";
  return `${where}, from the line directions (${km(s.turnedKm)} of ${km(s.totalKm)} of lines turned round${next}).${sure}`;
}
