import type { UnitSystem } from "@/db/schema";
import { cToF, kgToLb, kmToMi, m3sToCfs, mPerSToFtPerS, mToFt } from "@/lib/model/units";

/**
 * Display of SI quantities in the basin's unit system (SI or US customary).
 * Values are stored and computed in SI; only screens and exports convert.
 */
export interface Quantity {
  value: number;
  unit: string;
}

type Kind = "length" | "flow" | "depth" | "velocity" | "temperature" | "load" | "distance";

const TABLE: Record<Kind, Record<UnitSystem, { unit: string; convert: (si: number) => number; digits: number }>> = {
  length: { SI: { unit: "km", convert: (x) => x, digits: 2 }, US: { unit: "mi", convert: kmToMi, digits: 2 } },
  distance: { SI: { unit: "m", convert: (x) => x, digits: 0 }, US: { unit: "ft", convert: mToFt, digits: 0 } },
  flow: { SI: { unit: "m³/s", convert: (x) => x, digits: 3 }, US: { unit: "cfs", convert: m3sToCfs, digits: 2 } },
  depth: { SI: { unit: "m", convert: (x) => x, digits: 2 }, US: { unit: "ft", convert: mToFt, digits: 2 } },
  velocity: { SI: { unit: "m/s", convert: (x) => x, digits: 3 }, US: { unit: "ft/s", convert: mPerSToFtPerS, digits: 2 } },
  temperature: { SI: { unit: "°C", convert: (x) => x, digits: 1 }, US: { unit: "°F", convert: cToF, digits: 1 } },
  load: { SI: { unit: "kg/d", convert: (x) => x, digits: 1 }, US: { unit: "lb/d", convert: kgToLb, digits: 1 } },
};

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
