/** Metres in one international mile (exact, by the 1959 definition of the yard as 0.9144 m). */
export const METRES_PER_MILE = 1609.344;

export interface ScaleBar {
  /** Length the bar stands for, in its unit. */
  value: number;
  unit: "km" | "m" | "mi";
  /** Drawn length, in the figure's points. */
  points: number;
  label: string;
}

/** The largest 1, 2 or 5 × 10^n not above x (x > 0). */
function niceBelow(x: number): number {
  const p = Math.pow(10, Math.floor(Math.log10(x)));
  const m = x / p;
  // a hair of tolerance so that x exactly 2 × 10^n is not read as 1.999… × 10^n
  return (m >= 5 - 1e-9 ? 5 : m >= 2 - 1e-9 ? 2 : 1) * p;
}

const trim = (v: number) => Number(v.toPrecision(12)).toString();

/**
 * A scale bar for a map drawn at `metresPerPoint`: the longest round length (1, 2 or
 * 5 × 10^n of the unit) whose bar is at most `maxPoints` long. Metric bars read in
 * metres below 1 km, miles in decimals below 1 mi. Throws unless both inputs are positive.
 * Example: 100 m per point, at most 60 points → 5 km drawn 50 points long.
 */
export function scaleBar(metresPerPoint: number, maxPoints: number, system: "metric" | "imperial" = "metric"): ScaleBar {
  if (!(metresPerPoint > 0) || !(maxPoints > 0)) throw new RangeError("scaleBar: metres per point and the room for the bar must be positive");
  const maxMetres = metresPerPoint * maxPoints;
  if (system === "imperial") {
    const miles = niceBelow(maxMetres / METRES_PER_MILE);
    return { value: miles, unit: "mi", points: (miles * METRES_PER_MILE) / metresPerPoint, label: `${trim(miles)} mi` };
  }
  const metres = niceBelow(maxMetres);
  if (metres >= 1000) return { value: metres / 1000, unit: "km", points: metres / metresPerPoint, label: `${trim(metres / 1000)} km` };
  return { value: metres, unit: "m", points: metres / metresPerPoint, label: `${trim(metres)} m` };
}
