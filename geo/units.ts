/**
 * Unit conversions for imported attributes, to SI, on the one table of
 * exact definitions in lib/model/units.ts (international foot and mile,
 * US gallon = 231 in³, MGD = 10⁶ US gal/d). The names here are the
 * importer's; the numbers are that table's.
 */
import { withoutFloatNoise } from "@/lib/format/quantities";
import { FT3_TO_M3, FT_TO_M, MGD_TO_M3_S, MI2_TO_KM2, MI_TO_KM, SECONDS_PER_DAY as DAY_S } from "@/lib/model/units";

export const METRES_PER_FOOT = FT_TO_M;
export const KILOMETRES_PER_MILE = MI_TO_KM;
export const SECONDS_PER_DAY = DAY_S;
/** 1 ft³/s in m³/s: 0.3048³ = 0.028316846592 (exact). */
export const CUBIC_METRES_PER_SECOND_PER_CFS = FT3_TO_M3;
/** 1 MGD in m³/s: 10⁶ × 0.003785411784 / 86 400 ≈ 0.0438126364. */
export const CUBIC_METRES_PER_SECOND_PER_MGD = MGD_TO_M3_S;

export const FLOW_UNITS = ["m3/s", "cfs", "MGD"] as const;
export const DEPTH_UNITS = ["m", "ft"] as const;
export const DISTANCE_UNITS = ["km", "mi", "m", "ft"] as const;
export const VELOCITY_UNITS = ["m/s", "ft/s"] as const;
export const TEMPERATURE_UNITS = ["degC", "degF"] as const;
export const AREA_UNITS = ["km2", "mi2", "ha"] as const;

export type FlowUnit = (typeof FLOW_UNITS)[number];
export type DepthUnit = (typeof DEPTH_UNITS)[number];
export type DistanceUnit = (typeof DISTANCE_UNITS)[number];
export type VelocityUnit = (typeof VELOCITY_UNITS)[number];
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
export type AreaUnit = (typeof AREA_UNITS)[number];

const FLOW_TO_M3S: Record<FlowUnit, number> = {
  "m3/s": 1,
  cfs: CUBIC_METRES_PER_SECOND_PER_CFS,
  MGD: CUBIC_METRES_PER_SECOND_PER_MGD,
};
const DEPTH_TO_M: Record<DepthUnit, number> = { m: 1, ft: METRES_PER_FOOT };
const DISTANCE_TO_KM: Record<DistanceUnit, number> = {
  km: 1,
  mi: KILOMETRES_PER_MILE,
  m: 1e-3,
  ft: METRES_PER_FOOT / 1000,
};
const VELOCITY_TO_MPS: Record<VelocityUnit, number> = { "m/s": 1, "ft/s": METRES_PER_FOOT };
const AREA_TO_KM2: Record<AreaUnit, number> = { km2: 1, mi2: MI2_TO_KM2, ha: 0.01 };

/**
 * An imported value times its exact factor, kept to 12 significant digits so the stored SI
 * value carries no float noise (1.05 ft → 0.32004 m, not 0.32004000000000005); SI values pass unchanged.
 */
const convert = (value: number, factor: number) => (factor === 1 ? value : withoutFloatNoise(value * factor));

/** Flow to m³/s. Example: `flowToM3s(1, "cfs")` → 0.028316846592. */
export const flowToM3s = (value: number, unit: FlowUnit): number => convert(value, FLOW_TO_M3S[unit]);

/** Depth or elevation to metres. Example: `depthToM(10, "ft")` → 3.048. */
export const depthToM = (value: number, unit: DepthUnit): number => convert(value, DEPTH_TO_M[unit]);

/** Distance to kilometres. Example: `distanceToKm(1, "mi")` → 1.609344. */
export const distanceToKm = (value: number, unit: DistanceUnit): number => convert(value, DISTANCE_TO_KM[unit]);

/** Velocity to m/s. Example: `velocityToMps(1, "ft/s")` → 0.3048. */
export const velocityToMps = (value: number, unit: VelocityUnit): number => convert(value, VELOCITY_TO_MPS[unit]);

/** Area to km². Example: `areaToKm2(1, "mi2")` → 2.589988110336. */
export const areaToKm2 = (value: number, unit: AreaUnit): number => convert(value, AREA_TO_KM2[unit]);

/** Temperature to °C. Example: `temperatureToC(68, "degF")` → 20. */
export const temperatureToC = (value: number, unit: TemperatureUnit): number =>
  unit === "degC" ? value : withoutFloatNoise(((value - 32) * 5) / 9);
