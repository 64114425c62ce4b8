import type { FieldInfo, SourceFeature } from "./types";

const MAX_SAMPLES = 5;

/** A property value as text, or "" when empty (null, undefined, NaN, blank). */
export function valueText(v: unknown): string {
  if (v === null || v === undefined) return "";
  if (typeof v === "number") return Number.isFinite(v) ? String(v) : "";
  if (v instanceof Date) return Number.isNaN(v.getTime()) ? "" : v.toISOString().slice(0, 10);
  if (typeof v === "object") return JSON.stringify(v);
  return String(v).trim();
}

/** A property value as a finite number; undefined when empty; NaN when present but not a number. */
export function valueNumber(v: unknown): number | undefined {
  if (typeof v === "number") return Number.isFinite(v) ? v : undefined;
  const t = valueText(v);
  if (t === "") return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/**
 * The fields of a layer in first-seen order, each with its kind, how many features fill it
 * and up to five distinct sample values, for the field-mapping screen.
 */
export function detectFields(features: readonly SourceFeature[]): FieldInfo[] {
  const byName = new Map<string, { filled: number; numeric: boolean; samples: Set<string> }>();
  for (const f of features) {
    for (const [name, v] of Object.entries(f.properties)) {
      let info = byName.get(name);
      if (!info) {
        info = { filled: 0, numeric: true, samples: new Set() };
        byName.set(name, info);
      }
      const text = valueText(v);
      if (text === "") continue;
      info.filled++;
      if (!Number.isFinite(Number(text))) info.numeric = false;
      if (info.samples.size < MAX_SAMPLES) info.samples.add(text);
    }
  }
  return [...byName].map(([name, i]) => ({
    name,
    kind: i.filled === 0 ? "empty" : i.numeric ? "number" : "text",
    samples: [...i.samples],
    filled: i.filled,
  }));
}
