import type { DiagnosisEntry } from "@/lib/model/allocation/types";

/** A failing checkpoint with its deficit split into shares. */
export interface DiagnosisRow extends DiagnosisEntry {
  /** How far DO falls short of what is required, mg/L (≥ 0). */
  shortfall_mg_l: number;
  /** DO there with every discharger's contribution removed, mg/L. */
  do_without_dischargers_mg_l: number;
  /** True when background, SOD and upstream water alone already keep DO below the requirement. */
  fails_without_dischargers: boolean;
  /** Shares of the deficit, % (they add up to 100 when the parts add up to the deficit). */
  background_pct: number;
  sod_pct: number;
  dischargers_pct: number;
}

const pct = (part: number, whole: number) => (whole > 0 ? (100 * part) / whole : 0);

/**
 * The infeasibility diagnosis, worst shortfall first: for each checkpoint that fails with
 * every discharger at its floor, the shortfall, the DO it would have without any
 * discharger, and the shares of its deficit from background, SOD and dischargers.
 * Example: DO 4.0, required 5.0, deficit 4.0 of which dischargers 0.5 → shortfall 1.0,
 * 4.5 mg/L without dischargers (still failing), dischargers 12.5 %.
 */
export function diagnosisRows(entries: DiagnosisEntry[]): DiagnosisRow[] {
  return entries
    .map((e) => {
      const without = e.do_mg_l + e.from_dischargers_mg_l;
      return {
        ...e,
        shortfall_mg_l: Math.max(0, e.required_do_mg_l - e.do_mg_l),
        do_without_dischargers_mg_l: without,
        fails_without_dischargers: without < e.required_do_mg_l,
        background_pct: pct(e.from_background_mg_l, e.deficit_mg_l),
        sod_pct: pct(e.from_sod_mg_l, e.deficit_mg_l),
        dischargers_pct: pct(e.from_dischargers_mg_l, e.deficit_mg_l),
      };
    })
    .sort((a, b) => b.shortfall_mg_l - a.shortfall_mg_l);
}
