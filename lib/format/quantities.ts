import type { UnitSystem } from "@/lib/domain";
import { cfsToM3s, cToF, fToC, ftPerSToMPerS, ftToM, kgToLb, km2ToMi2, kmToMi, lbToKg, m3sToCfs, mi2ToKm2, miToKm, mPerSToFtPerS, mToFt } from "@/lib/model/units";

/**
 * Display of SI quantities in the basin's unit system (SI or US customary).
 * Values are stored and computed in SI; only screens and exports convert.
 */
export interface Quantity {
  value: number;
  unit: string;
}

export type QuantityKind = "length" | "flow" | "depth" | "velocity" | "temperature" | "load" | "distance" | "area";
type Kind = QuantityKind;

interface Rule {
  unit: string;
  convert: (si: number) => number;
  back: (shown: number) => number;
  digits: number;
}
const same = (x: number) => x;
const si = (unit: string, digits: number): Rule => ({ unit, convert: same, back: same, digits });

const TABLE: Record<Kind, Record<UnitSystem, Rule>> = {
  length: { SI: si("km", 2), US: { unit: "mi", convert: kmToMi, back: miToKm, digits: 2 } },
  distance: { SI: si("m", 0), US: { unit: "ft", convert: mToFt, back: ftToM, digits: 0 } },
  flow: { SI: si("m³/s", 3), US: { unit: "cfs", convert: m3sToCfs, back: cfsToM3s, digits: 2 } },
  depth: { SI: si("m", 2), US: { unit: "ft", convert: mToFt, back: ftToM, digits: 2 } },
  velocity: { SI: si("m/s", 3), US: { unit: "ft/s", convert: mPerSToFtPerS, back: ftPerSToMPerS, digits: 2 } },
  temperature: { SI: si("°C", 1), US: { unit: "°F", convert: cToF, back: fToC, digits: 1 } },
  load: { SI: si("kg/d", 1), US: { unit: "lb/d", convert: kgToLb, back: lbToKg, digits: 1 } },
  area: { SI: si("km²", 2), US: { unit: "mi²", convert: km2ToMi2, back: mi2ToKm2, digits: 2 } },
};

/**
 * Significant digits kept when a typed value is converted to SI. A conversion factor is
 * exact (1 ft = 0.3048 m) but the binary product is not (1.05 ft → 0.32004000000000005 m);
 * 12 significant digits keep every digit of a measured value times an exact factor with up
 * to 12 digits between them, and drop the float noise after them.
 */
export const CONVERSION_SIGNIFICANT = 12;

/** A value converted to SI without its float noise: `x` to CONVERSION_SIGNIFICANT significant digits. */
export const withoutFloatNoise = (x: number): number => roundSignificant(x, CONVERSION_SIGNIFICANT);

/** A value typed in the basin's unit, back to SI (without float noise: see CONVERSION_SIGNIFICANT). */
export const toSi = (kind: Kind, shown: number, system: UnitSystem): number =>
  system === "SI" ? shown : withoutFloatNoise(TABLE[kind][system].back(shown));

export function quantity(kind: Kind, si: number, system: UnitSystem): Quantity {
  const t = TABLE[kind][system];
  return { value: t.convert(si), unit: t.unit };
}

export const unitLabel = (kind: Kind, system: UnitSystem): string => TABLE[kind][system].unit;

/** "12.35" in the basin's unit, or "—" when the value is missing; never "-0.00". */
export function formatIn(kind: Kind, si: number | null | undefined, system: UnitSystem): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "—";
  const t = TABLE[kind][system];
  return fixed(t.convert(si), t.digits);
}

/**
 * A value in the basin's unit as an export writes it (CSV cell, GeoJSON property): a
 * number rounded by the export rule of its quantity (EXPORT_PRECISION), null when missing.
 * Example: exportIn("depth", 0.32004000000000005, "SI") → 0.32.
 */
export function exportIn(kind: Kind, si: number | null | undefined, system: UnitSystem): number | null {
  if (si === null || si === undefined || !Number.isFinite(si)) return null;
  return exportValue(kind, TABLE[kind][system].convert(si));
}

// ---------------------------------------------------------------------------
// One rounding rule per quantity, for screens (and the PDF) and for exports.

/** Quantities shown without a unit choice, beside the converted kinds above. */
export type Measure = Kind | "do" | "concentration" | "rate" | "percent" | "dual" | "time" | "ratio" | "coordinate";

/** Either a number of decimals or a number of significant figures. */
export type Precision = { decimals: number } | { significant: number };

const dec = (decimals: number): Precision => ({ decimals });
const sig = (significant: number): Precision => ({ significant });

/**
 * Screens and the PDF. DO to 0.01 mg/L (a meter reads to 0.01–0.1); concentrations to
 * 0.1 mg/L; rate coefficients to 3 significant figures (14.092 → 14.1 /d, 0.2304 → 0.230 /d);
 * percentages to 0.1; shadow prices and DO gained per unit load to 3 significant figures;
 * travel times to 0.01 d; ratios to 0.01. Converted kinds: the unit system's rule (TABLE).
 */
const SCREEN_PRECISION: Record<Exclude<Measure, Kind>, Precision> = {
  do: dec(2),
  concentration: dec(1),
  rate: sig(3),
  percent: dec(1),
  dual: sig(3),
  time: dec(2),
  ratio: dec(2),
  coordinate: dec(5),
};

/**
 * Exports (CSV and GeoJSON) keep one more figure than the screens, and never the float
 * noise of a computation: DO 0.001 mg/L, concentration 0.01 mg/L, rate 4 significant
 * figures, percent 0.01, dual 4 significant figures, time 0.0001 d, ratio 0.0001;
 * km or mi 0.001, m or ft 0.1, flow 4 significant figures, depth 0.001, velocity 0.001,
 * temperature 0.01, load 0.01 (kg/d or lb/d), drainage area 4 significant figures; longitude and latitude 7 decimals (about 1 cm).
 * docs/exports.md lists the same table.
 */
export const EXPORT_PRECISION: Record<Measure, Precision> = {
  do: dec(3),
  concentration: dec(2),
  rate: sig(4),
  percent: dec(2),
  dual: sig(4),
  time: dec(4),
  ratio: dec(4),
  coordinate: dec(7),
  length: dec(3),
  distance: dec(1),
  flow: sig(4),
  depth: dec(3),
  velocity: dec(3),
  temperature: dec(2),
  load: dec(2),
  area: sig(4),
};

const noNegativeZero = (x: number) => (x === 0 ? 0 : x);

/** `x` rounded to `decimals` places (the double's exact value, halves away from zero), never -0. */
export function roundDecimals(x: number, decimals: number): number {
  return noNegativeZero(Number(x.toFixed(decimals)));
}

/** `x` rounded to `significant` figures, never -0. Example: roundSignificant(0.000428219, 3) → 0.000428. */
export function roundSignificant(x: number, significant: number): number {
  if (x === 0 || !Number.isFinite(x)) return noNegativeZero(x);
  return noNegativeZero(Number(x.toPrecision(significant)));
}

const applyPrecision = (x: number, p: Precision) => ("decimals" in p ? roundDecimals(x, p.decimals) : roundSignificant(x, p.significant));

/** `x.toFixed(d)` that reads "0.00", never "-0.00", when `x` rounds to zero. */
const fixed = (x: number, d: number) => {
  const s = x.toFixed(d);
  return Number(s) === 0 ? (0).toFixed(d) : s;
};

/** Plain decimal text of a significant-figure rounding, scientific ("4.28 × 10⁻⁷") only beyond 10⁻⁶…10⁹. */
function significantText(x: number, significant: number): string {
  const r = roundSignificant(x, significant);
  if (r === 0) return "0";
  const exponent = Math.floor(Math.log10(Math.abs(r)));
  if (exponent < -6 || exponent >= 9) {
    const [mantissa, power] = r.toExponential(significant - 1).split("e");
    const sup = String(Number(power)).replace(/[-0-9]/g, (c) => "⁻⁰¹²³⁴⁵⁶⁷⁸⁹"["-0123456789".indexOf(c)]);
    return `${mantissa} × 10${sup}`;
  }
  // toFixed keeps trailing zeros that are significant (0.230), and no float digits beyond them
  return r.toFixed(Math.max(0, significant - 1 - exponent));
}

function precisionOf(measure: Measure, system: UnitSystem): Precision {
  if (measure in TABLE) return dec(TABLE[measure as Kind][system].digits);
  return SCREEN_PRECISION[measure as Exclude<Measure, Kind>];
}

/**
 * A number as a screen or the PDF shows it, by its quantity's rule; "—" when missing, never
 * "-0.0". Converted kinds take a value already in the basin's unit (use formatIn for SI).
 * Examples: formatNumber("rate", 14.092) → "14.1"; formatNumber("dual", 0.000428219) → "0.000428";
 * formatNumber("percent", -0.02) → "0.0".
 */
export function formatNumber(measure: Measure, x: number | null | undefined, system: UnitSystem = "SI"): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  const p = precisionOf(measure, system);
  return "decimals" in p ? fixed(x, p.decimals) : significantText(x, p.significant);
}

/** A number as an export writes it: rounded by EXPORT_PRECISION, null when missing. Example: exportValue("do", 7.543511140482473) → 7.544. */
export function exportValue(measure: Measure, x: number | null | undefined): number | null {
  if (x === null || x === undefined || !Number.isFinite(x)) return null;
  return applyPrecision(x, EXPORT_PRECISION[measure]);
}

/**
 * A percentage to `digits` decimals that never reads "-0.0": anything that rounds to
 * zero is "0.0". "—" when missing. Example: formatPercent(-0.02) → "0.0"; formatPercent(12.345) → "12.3".
 */
export function formatPercent(pct: number | null | undefined, digits = 1): string {
  if (pct === null || pct === undefined || !Number.isFinite(pct)) return "—";
  return fixed(pct, digits);
}

/**
 * A reduction from today's load in words: "12.5 % cut"; "no cut" when it rounds to zero;
 * "2.0 % above today" when the allocation exceeds today's load; "—" when unknown
 * (today's load is zero). Example: reductionText(-0.03) → "no cut".
 */
export function reductionText(pct: number | null | undefined, digits = 1): string {
  if (pct === null || pct === undefined || !Number.isFinite(pct)) return "—";
  const shown = formatPercent(Math.abs(pct), digits);
  if (Number(shown) === 0) return "no cut";
  return pct > 0 ? `${shown} % cut` : `${shown} % above today`;
}
