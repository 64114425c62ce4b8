import type { DepthVelocityFormula, KaFormula, KaMethod } from "@/lib/domain";
import { ModelInputError, requirePositive } from "./errors";

// How a reach's k_a is obtained (KaMethod; `depth-velocity` picks one of the three formulas by H and U)
// and the formula that actually produced a k_a (KaFormula, recorded with every run) are domain vocabulary.
export type { KaFormula, KaMethod };

/**
 * O'Connor & Dobbins (1958): k_a = 3.93·U^0.5/H^1.5 (1/d at 20 °C; U m/s, H m).
 * The SI form of 12.9·U^0.5/H^1.5 in ft/s and ft. Intended for deeper, slower rivers
 * (roughly H 0.3–9 m, U 0.15–0.5 m/s). Throws on non-positive U or H.
 * Example: `oconnorDobbins(0.3, 1.2)` → 1.6375
 */
export function oconnorDobbins(u_m_s: number, h_m: number): number {
  requirePositive(u_m_s, ["velocity_m_s"]);
  requirePositive(h_m, ["depth_m"]);
  return (3.93 * Math.sqrt(u_m_s)) / Math.pow(h_m, 1.5);
}

/**
 * Churchill, Elmore & Buckingham (1962): k_a = 5.026·U^0.969/H^1.673 (1/d at 20 °C; m/s, m).
 * SI form of 11.6·U^0.969/H^1.673 (ft/s, ft); fitted for H 0.6–3.4 m, U 0.55–1.5 m/s.
 * Throws on non-positive U or H. Example: `churchill(0.8, 1.5)` → 2.0545…
 */
export function churchill(u_m_s: number, h_m: number): number {
  requirePositive(u_m_s, ["velocity_m_s"]);
  requirePositive(h_m, ["depth_m"]);
  return (5.026 * Math.pow(u_m_s, 0.969)) / Math.pow(h_m, 1.673);
}

/**
 * Owens, Edwards & Gibbs (1964): k_a = 5.32·U^0.67/H^1.85 (1/d at 20 °C; m/s, m).
 * SI form of 21.6·U^0.67/H^1.85 (ft/s, ft); for shallow streams, H 0.1–0.6 m.
 * Throws on non-positive U or H. Example: `owensGibbs(0.3, 0.4)` → 12.935…
 */
export function owensGibbs(u_m_s: number, h_m: number): number {
  requirePositive(u_m_s, ["velocity_m_s"]);
  requirePositive(h_m, ["depth_m"]);
  return (5.32 * Math.pow(u_m_s, 0.67)) / Math.pow(h_m, 1.85);
}

/**
 * Tsivoglou & Neal (1976) energy-dissipation form: k_a = c·U·S (1/d at 20 °C) with slope S
 * (m/m), c = 31183 s/(m·d) for 0.0283 < Q < 0.4247 m³/s and 15308 for larger flows — the SI
 * forms of 0.11/ft and 0.054/ft times ΔH/t (1–15 cfs and 15–3000 cfs).
 * Throws for Q ≤ 0.0283 m³/s (outside the published range) or non-positive U, S.
 * Example: `tsivoglouNeal(0.3, 0.0005, 1.0)` → 2.2962.
 */
export function tsivoglouNeal(u_m_s: number, slope_m_m: number, q_m3_s: number): number {
  requirePositive(u_m_s, ["velocity_m_s"]);
  requirePositive(slope_m_m, ["slope_m_m"]);
  requirePositive(q_m3_s, ["flow_m3_s"]);
  if (q_m3_s <= 0.0283) {
    throw new ModelInputError(["flow_m3_s"], `Tsivoglou–Neal is published for Q > 0.0283 m³/s (got ${q_m3_s})`);
  }
  return (q_m3_s < 0.4247 ? 31183 : 15308) * u_m_s * slope_m_m;
}

/**
 * The depth/velocity selection rule (after Covar 1976): H < 0.61 m → Owens–Gibbs;
 * otherwise H > 3.45·U^2.5 → O'Connor–Dobbins; otherwise Churchill.
 * Example: `selectByDepthVelocity(0.3, 1.2)` → "oconnor-dobbins".
 */
export function selectByDepthVelocity(u_m_s: number, h_m: number): DepthVelocityFormula {
  requirePositive(u_m_s, ["velocity_m_s"]);
  requirePositive(h_m, ["depth_m"]);
  if (h_m < 0.61) return "owens-gibbs";
  if (h_m > 3.45 * Math.pow(u_m_s, 2.5)) return "oconnor-dobbins";
  return "churchill";
}

export interface ReaerationInput {
  method: KaMethod;
  velocity_m_s: number;
  depth_m: number;
  /** Needed for `given`. */
  ka20_per_day?: number;
  /** Needed for `tsivoglou-neal`. */
  slope_m_m?: number;
  /** Needed for `tsivoglou-neal`. */
  flow_m3_s?: number;
  /** Apply the floor k_a ≥ 0.6/H (Chin 2006). Default false. */
  floor?: boolean;
}

export interface ReaerationResult {
  ka20_per_day: number;
  /** The formula that gave the value (for `depth-velocity`, the one it selected). */
  formula: KaFormula;
  /** True when the 0.6/H floor replaced the formula's value. */
  floored: boolean;
}

/** The three formulas that need only U and H, by name. */
const BY_DEPTH_VELOCITY: Record<DepthVelocityFormula, (u_m_s: number, h_m: number) => number> = { "oconnor-dobbins": oconnorDobbins, churchill, "owens-gibbs": owensGibbs };

/**
 * k_a at 20 °C (1/d) for one segment by the requested method, with the optional floor
 * k_a ≥ 0.6/H (Chin, "Water-Quality Engineering in Natural Systems", 2006).
 * Throws a ModelInputError naming the missing field (ka20_per_day, slope_m_m) or bad value.
 * Example: `reaeration({ method: "depth-velocity", velocity_m_s: 0.3, depth_m: 1.2 })`
 * → { ka20_per_day: 1.6375, formula: "oconnor-dobbins", floored: false }.
 */
export function reaeration(o: ReaerationInput): ReaerationResult {
  let formula: KaFormula;
  let ka: number;
  switch (o.method) {
    case "given":
      if (o.ka20_per_day === undefined) throw new ModelInputError(["ka20_per_day"], 'is required when ka_method is "given"');
      formula = "given";
      ka = requirePositive(o.ka20_per_day, ["ka20_per_day"]);
      break;
    case "tsivoglou-neal":
      if (o.slope_m_m === undefined) throw new ModelInputError(["slope_m_m"], 'is required when ka_method is "tsivoglou-neal"');
      formula = o.method;
      ka = tsivoglouNeal(o.velocity_m_s, o.slope_m_m, o.flow_m3_s ?? NaN);
      break;
    case "oconnor-dobbins":
    case "churchill":
    case "owens-gibbs":
    case "depth-velocity": {
      const chosen = o.method === "depth-velocity" ? selectByDepthVelocity(o.velocity_m_s, o.depth_m) : o.method;
      formula = chosen;
      ka = BY_DEPTH_VELOCITY[chosen](o.velocity_m_s, o.depth_m);
      break;
    }
    default:
      throw new ModelInputError(["ka_method"], `unknown method "${String(o.method)}"`);
  }
  if (o.floor) {
    const floorValue = 0.6 / requirePositive(o.depth_m, ["depth_m"]);
    if (ka < floorValue) return { ka20_per_day: floorValue, formula, floored: true };
  }
  return { ka20_per_day: ka, formula, floored: false };
}
