/**
 * Velocity and depth of a reach at a given flow: hydraulic geometry (power laws in Q) or
 * Manning's equation for a trapezoidal section at normal depth. SI units throughout
 * (Q m³/s, lengths m, U m/s). Pure; MODEL.md §3 (docs/MODEL.md) says where the model uses them.
 */
import { bracketedRoot } from "./root";
import type { HydraulicGeometry } from "./types";

/** A prismatic channel for Manning's equation: bottom width b, side slope z (horizontal per vertical; 0 = rectangular). */
export interface ManningChannel {
  /** Manning's roughness n (s/m^(1/3)). */
  n: number;
  /** Bed (energy) slope, m/m. */
  slope_m_m: number;
  bottom_width_m: number;
  /** Horizontal run per unit rise of each bank; default 0 (rectangular). */
  side_slope?: number;
}

export interface SectionAtFlow {
  /** Normal depth: deepest point of the section, m. */
  flow_depth_m: number;
  area_m2: number;
  top_width_m: number;
  wetted_perimeter_m: number;
  hydraulic_radius_m: number;
  /** Mean depth A / T — the depth the DO model uses (reaeration, SOD per volume). */
  mean_depth_m: number;
  /** Mean velocity Q / A. */
  velocity_m_s: number;
}

/** Geometry of a trapezoidal section at flow depth y. */
export function trapezoid(bottomWidth: number, sideSlope: number, y: number): { area: number; top: number; perimeter: number } {
  return {
    area: (bottomWidth + sideSlope * y) * y,
    top: bottomWidth + 2 * sideSlope * y,
    perimeter: bottomWidth + 2 * y * Math.sqrt(1 + sideSlope * sideSlope),
  };
}

/** Manning's discharge (SI) of the channel flowing at depth y: Q = (1/n)·A·R^(2/3)·S^(1/2). */
export function manningFlow(ch: ManningChannel, y: number): number {
  const { area, perimeter } = trapezoid(ch.bottom_width_m, ch.side_slope ?? 0, y);
  if (area <= 0) return 0;
  return (area * Math.pow(area / perimeter, 2 / 3) * Math.sqrt(ch.slope_m_m)) / ch.n;
}

/**
 * The normal depth carrying flow q in the channel, and the section's mean depth and velocity
 * there. Q(y) rises monotonically with y for these sections, so the root is bracketed by
 * doubling an upper depth until it carries more than q. Throws a RangeError for a
 * non-positive flow, roughness, slope or width, or a negative side slope.
 */
export function manningSection(ch: ManningChannel, q: number): SectionAtFlow {
  const z = ch.side_slope ?? 0;
  if (!(q > 0)) throw new RangeError("flow must be positive");
  if (!(ch.n > 0)) throw new RangeError("n must be positive");
  if (!(ch.slope_m_m > 0)) throw new RangeError("slope_m_m must be positive");
  if (!(ch.bottom_width_m > 0)) throw new RangeError("bottom_width_m must be positive");
  if (!(z >= 0) || !Number.isFinite(z)) throw new RangeError("side_slope must be zero or positive");
  let hi = 1;
  for (let i = 0; manningFlow(ch, hi) < q; i++) {
    if (i > 200) throw new RangeError("no depth carries this flow");
    hi *= 2;
  }
  const y = bracketedRoot((d) => manningFlow(ch, d) - q, 0, hi, 1e-13 * hi);
  const { area, top, perimeter } = trapezoid(ch.bottom_width_m, z, y);
  return {
    flow_depth_m: y,
    area_m2: area,
    top_width_m: top,
    wetted_perimeter_m: perimeter,
    hydraulic_radius_m: area / perimeter,
    mean_depth_m: area / top,
    velocity_m_s: q / area,
  };
}

/** U = a·Q^b, H = c·Q^f at flow q. */
export function hydraulicGeometryAt(g: HydraulicGeometry, q: number): { velocity_m_s: number; depth_m: number } {
  return { velocity_m_s: g.a * Math.pow(q, g.b), depth_m: g.c * Math.pow(q, g.f) };
}

/** One measurement of a reach's mean velocity and/or mean depth at a known flow. */
export interface HydraulicMeasurement {
  flow_m3_s: number;
  velocity_m_s?: number;
  depth_m?: number;
}

export interface PowerLawFit {
  coefficient: number;
  exponent: number;
  /** Coefficient of determination of log y on log Q. */
  r2: number;
  /** Measurements used. */
  n: number;
}

/** Least-squares line through (log Q, log y): y = coefficient·Q^exponent. Needs two distinct flows. */
export function fitPowerLaw(points: { q: number; y: number }[]): PowerLawFit {
  const usable = points.filter((p) => p.q > 0 && p.y > 0 && Number.isFinite(p.q) && Number.isFinite(p.y));
  const n = usable.length;
  if (n < 2) throw new RangeError("at least two measurements with positive flow and value are needed");
  const xs = usable.map((p) => Math.log(p.q));
  const ys = usable.map((p) => Math.log(p.y));
  const mx = xs.reduce((s, x) => s + x, 0) / n;
  const my = ys.reduce((s, y) => s + y, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i] - mx) ** 2;
    sxy += (xs[i] - mx) * (ys[i] - my);
    syy += (ys[i] - my) ** 2;
  }
  if (sxx <= 0) throw new RangeError("the measurements need at least two different flows");
  const exponent = sxy / sxx;
  const intercept = my - exponent * mx;
  const r2 = syy === 0 ? 1 : (sxy * sxy) / (sxx * syy);
  return { coefficient: Math.exp(intercept), exponent, r2, n };
}

/** Hydraulic-geometry coefficients from measurements of velocity and depth at known flows (Leopold & Maddock's log-log fit). */
export function fitHydraulicGeometry(measurements: HydraulicMeasurement[]): { geometry: HydraulicGeometry; velocity: PowerLawFit; depth: PowerLawFit } {
  const velocity = fitPowerLaw(measurements.filter((m) => m.velocity_m_s !== undefined).map((m) => ({ q: m.flow_m3_s, y: m.velocity_m_s! })));
  const depth = fitPowerLaw(measurements.filter((m) => m.depth_m !== undefined).map((m) => ({ q: m.flow_m3_s, y: m.depth_m! })));
  return { geometry: { a: velocity.coefficient, b: velocity.exponent, c: depth.coefficient, f: depth.exponent }, velocity, depth };
}
