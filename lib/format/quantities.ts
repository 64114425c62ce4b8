import type { UnitSystem } from "@/db/schema";
import { cfsToM3s, cToF, fToC, ftPerSToMPerS, ftToM, kgToLb, kmToMi, lbToKg, m3sToCfs, miToKm, mPerSToFtPerS, mToFt } from "@/lib/model/units";

/**
 * Display of SI quantities in the basin's unit system (SI or US customary).
 * Values are stored and computed in SI; only screens and exports convert.
 */
export interface Quantity {
  value: number;
  unit: string;
}

export type QuantityKind = "length" | "flow" | "depth" | "velocity" | "temperature" | "load" | "distance";
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
};

/** A value typed in the basin's unit, back to SI. */
export const toSi = (kind: Kind, shown: number, system: UnitSystem): number => TABLE[kind][system].back(shown);

export function quantity(kind: Kind, si: number, system: UnitSystem): Quantity {
  const t = TABLE[kind][system];
  return { value: t.convert(si), unit: t.unit };
}

export const unitLabel = (kind: Kind, system: UnitSystem): string => TABLE[kind][system].unit;

/** "12.35" in the basin's unit, or "—" when the value is missing. */
export function formatIn(kind: Kind, si: number | null | undefined, system: UnitSystem): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return "—";
  const t = TABLE[kind][system];
  return t.convert(si).toFixed(t.digits);
}

/**
 * A percentage to `digits` decimals that never reads "-0.0": anything that rounds to
 * zero is "0.0". "—" when missing. Example: formatPercent(-0.02) → "0.0"; formatPercent(12.345) → "12.3".
 */
export function formatPercent(pct: number | null | undefined, digits = 1): string {
  if (pct === null || pct === undefined || !Number.isFinite(pct)) return "—";
  const shown = pct.toFixed(digits);
  return Number(shown) === 0 ? (0).toFixed(digits) : shown;
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
