import { doSaturationAtElevation } from "@/lib/model/do-saturation";

/*
 * Defaults a scenario falls back on, shared by the model-file builder and the scenario
 * form (kept apart from build-model-file so the form does not bundle the model).
 */

/**
 * Share of DO saturation assumed for headwater and tributary water when the scenario gives
 * no DO: 0.9 (common practice for unpolluted streams at critical summer conditions, stated
 * here as an assumption, not a measured value). A fixed default such as 7.5 mg/L would lie
 * above saturation at 30 °C (7.56 mg/L at sea level, less at altitude).
 */
export const DEFAULT_HEADWATER_DO_SHARE = 0.9;
/** How screens and reports name that default. */
export const DEFAULT_HEADWATER_DO_TEXT = "90 % of saturation at the water's temperature (common practice)";

/**
 * The default DO of natural inflow (mg/L): DEFAULT_HEADWATER_DO_SHARE of saturation
 * (Benson & Krause, lib/model/do-saturation) at its temperature (°C) and elevation (m).
 * Example: defaultHeadwaterDoMgL(30) → 0.9 × 7.559 ≈ 6.80 mg/L.
 */
export const defaultHeadwaterDoMgL = (temperatureC: number, elevationM = 0): number =>
  DEFAULT_HEADWATER_DO_SHARE * doSaturationAtElevation(temperatureC, elevationM);

/**
 * The network's own design flow at the outlet (m³/s): the sum of the outlet reaches'
 * designFlowM3s, or undefined when an outlet reach has none.
 */
export function networkOutletFlowM3s(reaches: readonly { downstreamId: string | null; attributes: Record<string, unknown> }[]): number | undefined {
  let sum = 0;
  for (const r of reaches.filter((x) => x.downstreamId === null)) {
    const q = r.attributes.designFlowM3s;
    if (typeof q !== "number" || !Number.isFinite(q)) return undefined;
    sum += q;
  }
  return sum > 0 ? sum : undefined;
}
