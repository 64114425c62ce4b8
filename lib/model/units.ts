/**
 * The one conversion table. Sagline is SI inside (km, m, m/s, m³/s, mg/L, kg/d, °C);
 * US customary units appear only at the edges. Every factor below is exact by definition
 * (international foot and pound of 1959, US gallon = 231 in³).
 */
export const FT_TO_M = 0.3048;
export const MI_TO_KM = 1.609344;
export const US_GAL_TO_L = 3.785411784;
export const LB_TO_KG = 0.45359237;
export const SECONDS_PER_DAY = 86_400;
/** 1 ft³ in m³ (exact: 0.3048³). */
export const FT3_TO_M3 = FT_TO_M ** 3;
/** 1 mi² in km² (exact: 1.609344²). */
export const MI2_TO_KM2 = MI_TO_KM ** 2;
/** 1 MGD (million US gallons per day) in m³/s (exact). */
export const MGD_TO_M3_S = (1e6 * US_GAL_TO_L) / 1000 / SECONDS_PER_DAY;
/** load (kg/d) = LOAD_FACTOR × Q (m³/s) × C (mg/L): 1 mg/L = 1 g/m³, 86 400 s/d, 1000 g/kg. */
export const LOAD_FACTOR = SECONDS_PER_DAY / 1000;

/** Feet → metres. Example: `ftToM(1)` → 0.3048. */
export const ftToM = (ft: number): number => ft * FT_TO_M;
/** Metres → feet. Example: `mToFt(0.3048)` → 1. */
export const mToFt = (m: number): number => m / FT_TO_M;
/** mi² → km². Example: `mi2ToKm2(1)` → 2.589988110336. */
export const mi2ToKm2 = (mi2: number): number => mi2 * MI2_TO_KM2;
/** km² → mi². */
export const km2ToMi2 = (km2: number): number => km2 / MI2_TO_KM2;
/** Miles → km. Example: `miToKm(1)` → 1.609344. */
export const miToKm = (mi: number): number => mi * MI_TO_KM;
/** km → miles. */
export const kmToMi = (km: number): number => km / MI_TO_KM;
/** ft/s → m/s. */
export const ftPerSToMPerS = (v: number): number => v * FT_TO_M;
/** m/s → ft/s. */
export const mPerSToFtPerS = (v: number): number => v / FT_TO_M;
/** cfs → m³/s. Example: `cfsToM3s(1)` → 0.028316846592. */
export const cfsToM3s = (cfs: number): number => cfs * FT3_TO_M3;
/** m³/s → cfs. */
export const m3sToCfs = (q: number): number => q / FT3_TO_M3;
/** MGD → m³/s. Example: `mgdToM3s(1)` → 0.0438126363… */
export const mgdToM3s = (mgd: number): number => mgd * MGD_TO_M3_S;
/** m³/s → MGD. */
export const m3sToMgd = (q: number): number => q / MGD_TO_M3_S;
/** lb/d → kg/d. */
export const lbToKg = (lb: number): number => lb * LB_TO_KG;
/** kg/d → lb/d. Example: `kgToLb(0.45359237)` → 1. */
export const kgToLb = (kg: number): number => kg / LB_TO_KG;
/** °F → °C. Example: `fToC(68)` → 20. */
export const fToC = (f: number): number => ((f - 32) * 5) / 9;
/** °C → °F. */
export const cToF = (c: number): number => (c * 9) / 5 + 32;

/** Load in kg/d carried by flow `q_m3_s` at concentration `c_mg_l`. Example: 1 m³/s × 1 mg/L → 86.4 kg/d. */
export const loadKgPerDay = (q_m3_s: number, c_mg_l: number): number => LOAD_FACTOR * q_m3_s * c_mg_l;
/** Concentration (mg/L) of load `w_kg_day` in flow `q_m3_s` (> 0). */
export const concentrationMgL = (w_kg_day: number, q_m3_s: number): number => w_kg_day / (LOAD_FACTOR * q_m3_s);
