import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { inverse, Matrix } from "ml-matrix";
import { ModelInputError } from "@/lib/model/errors";
import { compilePlan } from "@/lib/model/network/compile";
import { evaluatePlan } from "@/lib/model/network/evaluate";
import { doAt } from "@/lib/model/network/profile";
import type { Plan } from "@/lib/model/network/plan";
import type { ModelFile, ReachInput } from "@/lib/model/types";

/**
 * Calibration of kinetic coefficients to observed dissolved oxygen (a synoptic survey):
 * bounded nonlinear least squares by Levenberg–Marquardt (ml-levenberg-marquardt) on the
 * model's exact DO at each station, then standard errors from s²·(JᵀJ)⁻¹ with
 * s² = SSE/(n − p) and J the Jacobian of the modelled DO at the optimum (central
 * differences), the correlation of the estimates, and fit statistics. Pure.
 */

import { FIT_PARAMETERS, type FitParameter } from "@/lib/domain/calibration";

export { FIT_PARAMETERS, type FitParameter };

export interface Observation {
  /** Station id, when the survey names one. */
  station?: string;
  reach: string;
  /** km from the reach's head. */
  km: number;
  do_mg_l: number;
  /** Relative weight in the sum of squares; default 1. */
  weight?: number;
}

/** One fitted value, applied to every listed reach. */
export interface FitEntry {
  parameter: FitParameter;
  reaches: string[];
  min: number;
  max: number;
  start: number;
}

export interface FittedParameter {
  parameter: FitParameter;
  reaches: string[];
  value: number;
  std_error: number | null;
  /** The value sits on (within 1e-6 of the range of) its lower or upper bound. */
  at_bound: "min" | "max" | null;
}

export interface Residual {
  station: string | null;
  reach: string;
  km: number;
  observed_mg_l: number;
  modelled_mg_l: number;
  residual_mg_l: number;
}

export interface CalibrationResult {
  parameters: FittedParameter[];
  /** Correlation of the estimates (null where a standard error is undefined). */
  correlation: (number | null)[][];
  rmse_mg_l: number;
  bias_mg_l: number;
  /** Nash–Sutcliffe efficiency: 1 − SSE/Σ(obs − mean obs)². */
  nse: number | null;
  sse: number;
  iterations: number;
  residuals: Residual[];
  warnings: string[];
}

/** The model file with the entries' values set on their reaches. */
export function withParameters(file: ModelFile, fit: readonly FitEntry[], values: readonly number[]): ModelFile {
  const byReach = new Map<string, Partial<ReachInput>>();
  fit.forEach((f, i) => {
    for (const id of f.reaches) byReach.set(id, { ...byReach.get(id), [f.parameter]: values[i] });
  });
  return { ...file, reaches: file.reaches.map((r) => (byReach.has(r.id) ? { ...r, ...byReach.get(r.id) } : r)) };
}

/** The segment and travel time of (reach, km): the segment holding km (at an outfall, the one below it, after mixing). */
function locate(plan: Plan, reachId: string, km: number, path: (string | number)[]) {
  const ri = plan.reaches.findIndex((r) => r.id === reachId);
  if (ri < 0) throw new ModelInputError([...path, "reach"], `names no reach of the model file ("${reachId}")`);
  const r = plan.reaches[ri];
  const segs = Array.from({ length: r.segment_count }, (_, k) => r.first_segment + k);
  const last = plan.segments[segs[segs.length - 1]];
  if (!(km >= 0 && km <= last.km_end + 1e-9)) throw new ModelInputError([...path, "km"], `must lie within the reach (0–${last.km_end} km)`);
  const si = segs.find((s) => km >= plan.segments[s].km_start - 1e-12 && km < plan.segments[s].km_end) ?? segs[segs.length - 1];
  const seg = plan.segments[si];
  const span = seg.km_end - seg.km_start;
  const t_day = span > 0 ? (Math.min(km, seg.km_end) - seg.km_start) / span * seg.t_day : 0;
  return { segment: si, t_day, km };
}

/** Modelled DO at every observation (exact, not interpolated from profile points). */
export function modelledDo(file: ModelFile, observations: readonly Observation[]): number[] {
  const plan = compilePlan(file);
  const states = evaluatePlan(plan);
  return observations.map((o, i) => doAt(plan, states, locate(plan, o.reach, o.km, ["calibration", "observations", i])));
}

function checkInput(file: ModelFile, observations: readonly Observation[], fit: readonly FitEntry[]) {
  const ids = new Set(file.reaches.map((r) => r.id));
  if (observations.length === 0) throw new ModelInputError(["calibration", "observations"], "needs at least one observation");
  if (fit.length === 0) throw new ModelInputError(["calibration", "fit"], "names no parameter to fit");
  if (observations.length <= fit.length) throw new ModelInputError(["calibration", "observations"], `has ${observations.length} observation(s) for ${fit.length} parameter(s): fitting needs more observations than parameters`);
  fit.forEach((f, i) => {
    const path = ["calibration", "fit", i];
    if (!FIT_PARAMETERS.includes(f.parameter)) throw new ModelInputError([...path, "parameter"], `must be one of ${FIT_PARAMETERS.join(", ")}`);
    if (f.reaches.length === 0) throw new ModelInputError([...path, "reaches"], "names no reach");
    for (const id of f.reaches) if (!ids.has(id)) throw new ModelInputError([...path, "reaches"], `names no reach of the model file ("${id}")`);
    if (!(Number.isFinite(f.min) && Number.isFinite(f.max) && f.min < f.max)) throw new ModelInputError([...path, "min"], "must be below max");
    if (!(f.start >= f.min && f.start <= f.max)) throw new ModelInputError([...path, "start"], "must lie within min–max");
    if (f.parameter === "ka_multiplier" && f.min <= 0) throw new ModelInputError([...path, "min"], "must be above 0 for a k_a multiplier");
    if (f.min < 0) throw new ModelInputError([...path, "min"], "cannot be negative");
  });
  const seen = new Set<string>();
  fit.forEach((f, i) => {
    for (const id of f.reaches) {
      const key = `${f.parameter}:${id}`;
      if (seen.has(key)) throw new ModelInputError(["calibration", "fit", i, "reaches"], `fits ${f.parameter} of ${id} twice`);
      seen.add(key);
    }
  });
  observations.forEach((o, i) => {
    if (!Number.isFinite(o.do_mg_l)) throw new ModelInputError(["calibration", "observations", i, "do_mg_l"], "must be a number");
    if (o.weight !== undefined && !(o.weight > 0)) throw new ModelInputError(["calibration", "observations", i, "weight"], "must be above 0");
  });
}

/** Jacobian of the weighted modelled DO at `values` by central differences (one-sided at a bound). */
export function jacobian(f: (values: number[]) => number[], values: readonly number[], fit: readonly FitEntry[]): number[][] {
  const columns = values.map((v, j) => {
    const h = Math.max(1e-6, 1e-4 * Math.abs(v));
    const up = Math.min(v + h, fit[j].max);
    const down = Math.max(v - h, fit[j].min);
    const a = f(values.map((x, k) => (k === j ? up : x)));
    const b = f(values.map((x, k) => (k === j ? down : x)));
    return a.map((ai, i) => (ai - b[i]) / (up - down));
  });
  return columns[0].map((_, i) => columns.map((c) => c[i]));
}

/**
 * Fits `fit` to `observations` on `file` (its own conditions: the survey day's flows and
 * temperatures). Throws ModelInputError naming the field at fault.
 */
export function calibrate(
  file: ModelFile,
  observations: readonly Observation[],
  fit: readonly FitEntry[],
  options: { maxIterations?: number; onProgress?: (iterations: number, limit: number) => void } = {},
): CalibrationResult {
  checkInput(file, observations, fit);
  const w = observations.map((o) => Math.sqrt(o.weight ?? 1));
  const obs = observations.map((o) => o.do_mg_l);
  // one model evaluation per parameter vector, shared by all observations (the library asks per point)
  let cacheKey = "";
  let cacheValue: number[] = [];
  const model = (values: readonly number[]) => {
    const key = values.join(",");
    if (key !== cacheKey) {
      cacheValue = modelledDo(withParameters(file, fit, values), observations);
      cacheKey = key;
    }
    return cacheValue;
  };
  // ml-levenberg-marquardt stops at a target error or an iteration count; with real data the
  // sum of squares has no known floor, so it runs in rounds until a round no longer improves it
  // (relative change below 1e-10) or moves the parameters (below 1e-9 of their range)
  const limit = options.maxIterations ?? 200;
  let current = fit.map((f) => f.start);
  let iterations = 0;
  let previous = Infinity;
  for (;;) {
    const lm = levenbergMarquardt(
      { x: observations.map((_, i) => i), y: obs.map((y, i) => y * w[i]) },
      (values) => (i) => model(values)[i] * w[i],
      {
        initialValues: current,
        minValues: fit.map((f) => f.min),
        maxValues: fit.map((f) => f.max),
        gradientDifference: fit.map((f) => Math.max(1e-6, 1e-4 * (f.max - f.min))),
        centralDifference: true,
        damping: 1e-2,
        maxIterations: Math.min(10, limit - iterations),
        errorTolerance: 1e-12,
      },
    );
    iterations += lm.iterations;
    options.onProgress?.(iterations, limit);
    const moved = lm.parameterValues.some((v, j) => Math.abs(v - current[j]) > 1e-9 * (fit[j].max - fit[j].min));
    current = lm.parameterValues;
    const error = lm.parameterError;
    const settled = previous - error <= 1e-10 * Math.max(previous, 1e-30) || !moved;
    previous = Math.min(previous, error);
    if (settled || iterations >= limit || error <= 1e-12) break;
  }
  const lm = { parameterValues: current, iterations };
  const values = lm.parameterValues;
  const modelled = model(values);
  const residuals = obs.map((y, i) => y - modelled[i]);
  const sse = residuals.reduce((s, r, i) => s + (w[i] * r) ** 2, 0);
  const n = obs.length;
  const p = fit.length;
  const J = jacobian((v) => model(v).map((m, i) => m * w[i]), values, fit);
  const warnings: string[] = [];
  let cov: Matrix | null = null;
  try {
    const jtj = new Matrix(J).transpose().mmul(new Matrix(J));
    cov = inverse(jtj).mul(sse / (n - p));
  } catch {
    cov = null;
  }
  const atBound = (j: number): FittedParameter["at_bound"] => {
    const f = fit[j];
    const tol = 1e-6 * (f.max - f.min);
    return values[j] <= f.min + tol ? "min" : values[j] >= f.max - tol ? "max" : null;
  };
  const se = values.map((_, j) => {
    const v = cov?.get(j, j);
    return v !== undefined && Number.isFinite(v) && v >= 0 ? Math.sqrt(v) : null;
  });
  const parameters = fit.map((f, j) => ({ parameter: f.parameter, reaches: [...f.reaches], value: values[j], std_error: se[j], at_bound: atBound(j) }));
  for (const q of parameters) {
    const names = `${q.parameter} (${q.reaches.join(", ")})`;
    if (q.at_bound) warnings.push(`${names} sits on its ${q.at_bound === "min" ? "lower" : "upper"} bound: the data would take it further; its standard error assumes it is free`);
    if (q.std_error === null) warnings.push(`${names} cannot be identified from these observations (the fit does not change with it)`);
    else if (Math.abs(q.value) > 0 && q.std_error > Math.abs(q.value)) warnings.push(`${names} is poorly determined: its standard error exceeds its value`);
  }
  const correlation = values.map((_, a) =>
    values.map((__, b) => {
      const c = cov?.get(a, b);
      return se[a] && se[b] && c !== undefined && Number.isFinite(c) ? c / (se[a]! * se[b]!) : null;
    }),
  );
  for (let a = 0; a < p; a++) for (let b = a + 1; b < p; b++) if (Math.abs(correlation[a][b] ?? 0) > 0.95) warnings.push(`${fit[a].parameter} and ${fit[b].parameter} are strongly correlated (${correlation[a][b]!.toFixed(2)}): the data hardly tell them apart`);
  const mean = obs.reduce((s, y) => s + y, 0) / n;
  const spread = obs.reduce((s, y) => s + (y - mean) ** 2, 0);
  const plainSse = residuals.reduce((s, r) => s + r * r, 0);
  return {
    parameters,
    correlation,
    rmse_mg_l: Math.sqrt(plainSse / n),
    bias_mg_l: -residuals.reduce((s, r) => s + r, 0) / n,
    nse: spread > 0 ? 1 - plainSse / spread : null,
    sse,
    iterations: lm.iterations,
    residuals: observations.map((o, i) => ({ station: o.station ?? null, reach: o.reach, km: o.km, observed_mg_l: obs[i], modelled_mg_l: modelled[i], residual_mg_l: residuals[i] })),
    warnings,
  };
}

/** Statistics of a calibrated model against another survey, without refitting (validation). */
export function validate(file: ModelFile, observations: readonly Observation[]): Pick<CalibrationResult, "rmse_mg_l" | "bias_mg_l" | "nse" | "residuals"> {
  const modelled = modelledDo(file, observations);
  const residuals = observations.map((o, i) => o.do_mg_l - modelled[i]);
  const n = observations.length;
  const mean = observations.reduce((s, o) => s + o.do_mg_l, 0) / n;
  const spread = observations.reduce((s, o) => s + (o.do_mg_l - mean) ** 2, 0);
  const sse = residuals.reduce((s, r) => s + r * r, 0);
  return {
    rmse_mg_l: Math.sqrt(sse / n),
    bias_mg_l: -residuals.reduce((s, r) => s + r, 0) / n,
    nse: spread > 0 ? 1 - sse / spread : null,
    residuals: observations.map((o, i) => ({ station: o.station ?? null, reach: o.reach, km: o.km, observed_mg_l: o.do_mg_l, modelled_mg_l: modelled[i], residual_mg_l: residuals[i] })),
  };
}
