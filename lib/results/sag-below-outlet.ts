import type { RunResult } from "@/lib/model/network/run";

/** A run's lowest DO lies at the downstream end of an outlet reach with DO still falling there. */
export interface SagBelowOutlet {
  /** The outlet reach. */
  reach: string;
  /** DO at the outlet (mg/L), the lowest the model computes. */
  doMgL: number;
  /** How fast DO still falls over the last profile step (mg/L per km, positive). */
  fallMgLPerKm: number;
}

/** Positions within this of the reach's end count as the end (km; profiles are spaced 0.05 km or more). */
const AT_END_KM = 1e-6;

/**
 * Whether the sag continues below the modelled network: the run's minimum DO is at the
 * downstream end of a reach that drains out of the network (`downstream` null) and DO is
 * still falling into that end, so the true critical point lies further downstream and the
 * lowest DO there is lower than any the run shows. Returns null otherwise (the minimum is
 * inside the network, or DO has levelled off or is rising at the outlet).
 * Example: one 2 km reach whose sag would bottom out at 12 km → { reach: "R1", doMgL: 6.1, … }.
 */
export function sagBelowOutlet(run: RunResult, reaches: readonly { id: string; downstream: string | null }[]): SagBelowOutlet | null {
  const outlets = new Set(reaches.filter((r) => r.downstream === null).map((r) => r.id));
  const at = run.reaches.find((r) => r.id === run.minimum.reach);
  if (!at || !outlets.has(at.id) || at.points.length < 2) return null;
  const last = at.points[at.points.length - 1];
  const before = at.points[at.points.length - 2];
  if (Math.abs(at.critical.km - last.km) > AT_END_KM) return null;
  const step = last.km - before.km;
  const fall = before.do_mg_l - last.do_mg_l;
  if (!(step > 0) || !(fall > 0)) return null;
  return { reach: at.id, doMgL: last.do_mg_l, fallMgLPerKm: fall / step };
}
