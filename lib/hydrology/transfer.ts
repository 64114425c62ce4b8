/**
 * Carrying a gauged design flow to an ungauged point by the drainage-area ratio:
 * Q_u = Q_g · (A_u / A_g)^e, with the exponent e = 1 by default (common practice: flow
 * proportional to area; a regional study may give another exponent). Pure.
 */

export interface AreaTransfer {
  /** The transferred flow, in the gauge flow's unit. */
  flow: number;
  /** (A_u / A_g)^e. */
  ratio: number;
  exponent: number;
  /** A sentence saying where the value came from, for the scenario and the plan record. */
  rule: string;
}

/** Drainage areas in any one unit (km² throughout Sagline). Throws a RangeError naming the value at fault. */
export function transferByDrainageArea(gaugeFlow: number, gaugeAreaKm2: number, targetAreaKm2: number, exponent = 1, gaugeName = "the gauge"): AreaTransfer {
  if (!(gaugeFlow >= 0) || !Number.isFinite(gaugeFlow)) throw new RangeError("gauge flow must be zero or positive");
  if (!(gaugeAreaKm2 > 0) || !Number.isFinite(gaugeAreaKm2)) throw new RangeError("gauge drainage area must be positive");
  if (!(targetAreaKm2 > 0) || !Number.isFinite(targetAreaKm2)) throw new RangeError("drainage area must be positive");
  if (!(exponent > 0) || !Number.isFinite(exponent)) throw new RangeError("exponent must be positive");
  const ratio = Math.pow(targetAreaKm2 / gaugeAreaKm2, exponent);
  const e = exponent === 1 ? "" : `^${exponent}`;
  return {
    flow: gaugeFlow * ratio,
    ratio,
    exponent,
    rule: `${gaugeName}'s value × (${targetAreaKm2} km² / ${gaugeAreaKm2} km²)${e}`,
  };
}
