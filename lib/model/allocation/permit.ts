import { cbodToBod5Ratio } from "../bod";
import { concentrationMgL, kgToLb } from "../units";

/** Permit terms of one allocation (MODEL.md §6). */
export interface PermitTerms {
  cbodu_kg_day: number;
  cbodu_lb_day: number;
  bod5_kg_day: number;
  bod5_lb_day: number;
  /** Effluent BOD5 at design flow. */
  bod5_mg_l: number;
  cbodu_mg_l: number;
  /** Reduction from today's load, %; null when today's load is zero. */
  reduction_pct: number | null;
  /** f = CBODu/BOD5 from the bottle rate, shown wherever a BOD5 figure is derived. */
  cbodu_bod5_ratio: number;
  bottle_k_per_day: number;
}

/**
 * Permit terms for an allocated CBODu load W (kg/d) of a discharger with design flow Q:
 * BOD5 = W/f with f = 1/(1 − e^(−5·k1)); effluent BOD5 (mg/L) = BOD5/(86.4·Q);
 * reduction = 100·(1 − W/W_today). Example: W 100 kg/d, Q 0.1 m³/s, k1 0.23, today 200 →
 * bod5 68.34 kg/d, 7.91 mg/L, reduction 50 %.
 */
export function permitTerms(w_kg_day: number, flow_m3_s: number, bottleK_per_day: number, today_kg_day: number): PermitTerms {
  const f = cbodToBod5Ratio(bottleK_per_day);
  const bod5 = w_kg_day / f;
  return {
    cbodu_kg_day: w_kg_day,
    cbodu_lb_day: kgToLb(w_kg_day),
    bod5_kg_day: bod5,
    bod5_lb_day: kgToLb(bod5),
    bod5_mg_l: concentrationMgL(bod5, flow_m3_s),
    cbodu_mg_l: concentrationMgL(w_kg_day, flow_m3_s),
    reduction_pct: today_kg_day > 0 ? 100 * (1 - w_kg_day / today_kg_day) : null,
    cbodu_bod5_ratio: f,
    bottle_k_per_day: bottleK_per_day,
  };
}
