import { ModelInputError, requireFinite, requirePositive } from "./errors";

/** Default bottle (laboratory) CBOD rate, 1/d base e at 20 °C — common practice for treated effluent. */
export const DEFAULT_BOTTLE_K_PER_DAY = 0.23;

function requireFraction(p: number, name: string): void {
  requireFinite(p, [name]);
  if (p <= 0 || p > 1) throw new ModelInputError([name], `must be in (0, 1] (got ${p})`);
}

/**
 * BOD5 (mg/L) from an unseeded dilution test: (D1 − D2) / P.
 * Source: APHA Standard Methods 5210 B. D1/D2 = DO of the diluted sample before/after
 * 5 d incubation (mg/L); P = decimal volumetric fraction of sample in the bottle.
 * Throws when P is outside (0, 1] or an input is not finite.
 * Example: `bod5FromDilution({ d1_mg_l: 8, d2_mg_l: 4, p: 0.1 })` → 40.
 */
export function bod5FromDilution(o: { d1_mg_l: number; d2_mg_l: number; p: number }): number {
  requireFinite(o.d1_mg_l, ["d1_mg_l"]);
  requireFinite(o.d2_mg_l, ["d2_mg_l"]);
  requireFraction(o.p, "p");
  return (o.d1_mg_l - o.d2_mg_l) / o.p;
}

/**
 * BOD5 (mg/L) from a seeded dilution test: [(D1 − D2) − (B1 − B2)·f] / P.
 * Source: APHA Standard Methods 5210 B. B1/B2 = DO of the seed control before/after;
 * f = ratio of seed in the sample bottle to seed in the control. Pass `seed_correction_mg_l`
 * instead of B1/B2/f when the seed's oxygen use is known directly (see seedCorrectionMgL).
 * Throws when P is outside (0, 1], when neither or both seed forms are given, or on NaN.
 * Example: Spellman's Ex. 19.6 first bottle → 16.32.
 */
export function bod5FromSeededDilution(o: {
  d1_mg_l: number;
  d2_mg_l: number;
  p: number;
  b1_mg_l?: number;
  b2_mg_l?: number;
  f?: number;
  seed_correction_mg_l?: number;
}): number {
  const hasBottle = o.b1_mg_l !== undefined || o.b2_mg_l !== undefined || o.f !== undefined;
  const hasDirect = o.seed_correction_mg_l !== undefined;
  if (hasBottle === hasDirect) {
    throw new ModelInputError(["seed_correction_mg_l"], "give either b1_mg_l, b2_mg_l and f, or seed_correction_mg_l");
  }
  let correction: number;
  if (hasDirect) {
    correction = requireFinite(o.seed_correction_mg_l as number, ["seed_correction_mg_l"]);
  } else {
    if (o.b1_mg_l === undefined || o.b2_mg_l === undefined || o.f === undefined) {
      throw new ModelInputError(["f"], "b1_mg_l, b2_mg_l and f must all be given");
    }
    correction = (requireFinite(o.b1_mg_l, ["b1_mg_l"]) - requireFinite(o.b2_mg_l, ["b2_mg_l"])) * requireFinite(o.f, ["f"]);
  }
  requireFinite(o.d1_mg_l, ["d1_mg_l"]);
  requireFinite(o.d2_mg_l, ["d2_mg_l"]);
  requireFraction(o.p, "p");
  return (o.d1_mg_l - o.d2_mg_l - correction) / o.p;
}

/**
 * Oxygen used by the seed in one bottle (mg/L): seed BOD × seed volume / bottle volume.
 * This is the (B1 − B2)·f term of Standard Methods 5210 B expressed from a known seed BOD.
 * Throws on non-positive volumes. Example: `seedCorrectionMgL(204, 1, 300)` → 0.68.
 */
export function seedCorrectionMgL(seedBod_mg_l: number, seed_ml: number, bottle_ml: number): number {
  requireFinite(seedBod_mg_l, ["seed_bod_mg_l"]);
  requirePositive(seed_ml, ["seed_ml"]);
  requirePositive(bottle_ml, ["bottle_ml"]);
  return (seedBod_mg_l * seed_ml) / bottle_ml;
}

/**
 * Fraction of ultimate CBOD exerted after `t_day` at bottle rate k1: 1 − e^(−k1·t).
 * First-order BOD kinetics (Streeter & Phelps 1925). Throws when k1 ≤ 0 or t ≤ 0.
 * Example: `bodExertedFraction(0.23, 5)` → 0.6834…
 */
export function bodExertedFraction(bottleK_per_day: number, t_day: number): number {
  requirePositive(bottleK_per_day, ["bottle_k_per_day"]);
  requirePositive(t_day, ["t_day"]);
  return -Math.expm1(-bottleK_per_day * t_day);
}

/**
 * Ultimate CBOD (mg/L) from BOD measured at t days: L0 = BODt / (1 − e^(−k1·t)).
 * Throws when k1 ≤ 0 or t ≤ 0. Example: `ultimateFromBodT(10, 0.23, 5)` → 14.6335…
 */
export function ultimateFromBodT(bodT_mg_l: number, bottleK_per_day: number, t_day = 5): number {
  return requireFinite(bodT_mg_l, ["bod_mg_l"]) / bodExertedFraction(bottleK_per_day, t_day);
}

/**
 * BOD at t days (mg/L) from ultimate CBOD: BODt = L0·(1 − e^(−k1·t)). Inverse of ultimateFromBodT.
 * Example: `bodTFromUltimate(14.6335, 0.23, 5)` → 10.0.
 */
export function bodTFromUltimate(cbodu_mg_l: number, bottleK_per_day: number, t_day = 5): number {
  return requireFinite(cbodu_mg_l, ["cbodu_mg_l"]) * bodExertedFraction(bottleK_per_day, t_day);
}

/**
 * Ratio f = CBODu/BOD5 = 1/(1 − e^(−5·k1)), used to turn CBODu allocations into BOD5 permit
 * terms. Example: `cbodToBod5Ratio(0.23)` → 1.46335… (≈ 1.46 for the default bottle rate).
 */
export function cbodToBod5Ratio(bottleK_per_day: number = DEFAULT_BOTTLE_K_PER_DAY): number {
  return 1 / bodExertedFraction(bottleK_per_day, 5);
}
