/**
 * Sagline's DO colour scale: bands relative to the basin's criterion, from the
 * palette in tailwind.config.ts. Anoxic water (the model's DO below zero) has its
 * own band and is never shown as a negative concentration.
 */
export type DoBand = "anoxic" | "below" | "near" | "meets" | "ample";

export interface DoBandStop {
  band: DoBand;
  label: string;
  colour: string;
  /** Lower edge of the band, mg/L (null: open below). */
  from_mg_l: number | null;
  /** Upper edge of the band, mg/L (null: open above). */
  to_mg_l: number | null;
}

export interface DoScaleOptions {
  /** Width of the "near the criterion" band above it, mg/L. Default 1. */
  near_mg_l?: number;
  /** DO this far above the criterion counts as ample, mg/L. Default 2. */
  ample_mg_l?: number;
}

/** Palette colours (tailwind.config.ts): clay for below, ochre for close, reed and tarn for comfortable, ink for anoxic. */
export const DO_BAND_COLOURS: Record<DoBand, string> = {
  anoxic: "#1d2a33",
  below: "#b5523b",
  near: "#c08a2e",
  meets: "#7b8f4a",
  ample: "#3d8184",
};

/**
 * DO within this much under the criterion counts as meeting it on screens and in
 * exports: an allocation holds DO at the criterion to the LP's tolerance (1e-6 mg/L
 * by default), so its binding checkpoints may land a hair below it.
 */
export const CRITERION_TOLERANCE_MG_L = 1e-4;

/** Whether DO is below the criterion by more than the solver's tolerance. */
export const isBelowCriterion = (doMgL: number, criterionMgL: number): boolean => doMgL < criterionMgL - CRITERION_TOLERANCE_MG_L;

function edges(criterionMgL: number, o: DoScaleOptions) {
  const near = o.near_mg_l ?? 1;
  const ample = o.ample_mg_l ?? 2;
  if (!(near > 0) || !(ample > near)) throw new RangeError("DO scale: need 0 < near_mg_l < ample_mg_l");
  return { criterion: criterionMgL, near: criterionMgL + near, ample: criterionMgL + ample };
}

/**
 * The band of a DO value: anoxic below 0 mg/L; below under the criterion; near up to
 * criterion + near_mg_l; meets up to criterion + ample_mg_l; ample above.
 * Example: criterion 5 → 4.9 "below", 5.0 "near", 6.0 "meets", 7.0 "ample", −0.1 "anoxic".
 */
export function doBand(doMgL: number, criterionMgL: number, options: DoScaleOptions = {}): DoBand {
  const e = edges(criterionMgL, options);
  if (doMgL < 0) return "anoxic";
  if (isBelowCriterion(doMgL, e.criterion)) return "below";
  if (doMgL < e.near) return "near";
  if (doMgL < e.ample) return "meets";
  return "ample";
}

/** The colour of a DO value (see doBand). */
export const doColour = (doMgL: number, criterionMgL: number, options: DoScaleOptions = {}): string =>
  DO_BAND_COLOURS[doBand(doMgL, criterionMgL, options)];

/** Legend stops from the highest band to anoxic, with their DO ranges in mg/L. */
export function doLegend(criterionMgL: number, options: DoScaleOptions = {}): DoBandStop[] {
  const e = edges(criterionMgL, options);
  const f = (x: number) => x.toFixed(1);
  return [
    { band: "ample", label: `${f(e.ample)} mg/L and above`, colour: DO_BAND_COLOURS.ample, from_mg_l: e.ample, to_mg_l: null },
    { band: "meets", label: `${f(e.near)}–${f(e.ample)} mg/L`, colour: DO_BAND_COLOURS.meets, from_mg_l: e.near, to_mg_l: e.ample },
    { band: "near", label: `${f(e.criterion)}–${f(e.near)} mg/L, close to the criterion`, colour: DO_BAND_COLOURS.near, from_mg_l: e.criterion, to_mg_l: e.near },
    { band: "below", label: `below the ${f(e.criterion)} mg/L criterion`, colour: DO_BAND_COLOURS.below, from_mg_l: 0, to_mg_l: e.criterion },
    { band: "anoxic", label: "anoxic (no oxygen left)", colour: DO_BAND_COLOURS.anoxic, from_mg_l: null, to_mg_l: 0 },
  ];
}

/** DO as shown on screens and in exports: "anoxic" instead of a negative figure. */
export function formatDo(doMgL: number | null | undefined, digits = 2): string {
  if (doMgL === null || doMgL === undefined || !Number.isFinite(doMgL)) return "—";
  return doMgL < 0 ? "anoxic" : doMgL.toFixed(digits);
}
