import type { RunResult } from "@/lib/model/network/run";
import { kmToMi } from "@/lib/model/units";
import type { PlacedSample } from "@/lib/survey/place-stations";
import type { ProfileSeries } from "./profile-series";

/**
 * A synoptic survey's observed DO against a run's modelled DO under one condition: the
 * modelled DO at each sample's reach and km, read off the run's profile points by linear
 * interpolation, the residual (observed − modelled), and goodness-of-fit statistics over
 * the samples that lie on the run's network. Pure.
 */

/** What a sample needs here (a placed survey sample has it all). */
export type SurveySampleInput = Pick<PlacedSample, "station" | "time" | "reach" | "km" | "do_mg_l">;

/** A profile point as the interpolation reads it: km from the reach head, DO as computed (may be below zero). */
export interface ProfileDoPoint {
  km: number;
  do_mg_l: number;
}

interface RowBase {
  station: string;
  time: string | null;
  reach: string;
  /** km from the reach's head (model length). */
  km: number;
  observed_mg_l: number;
}

export interface MatchedRow extends RowBase {
  onNetwork: true;
  modelled_mg_l: number;
  /** observed − modelled, mg/L. */
  residual_mg_l: number;
}

export interface OffNetworkRow extends RowBase {
  onNetwork: false;
  /** "reach": the run has no such reach; "beyond": km lies past the reach's length in the run. */
  why: "reach" | "beyond";
  modelled_mg_l: null;
  residual_mg_l: null;
}

export type ResidualRow = MatchedRow | OffNetworkRow;

export interface FitStatistics {
  /** Pairs the statistics are over. */
  n: number;
  /** √(Σ(o − m)²/n), mg/L; null when n = 0. */
  rmse_mg_l: number | null;
  /** Mean of modelled − observed, mg/L (negative: the model reads low), as lib/calibration reports it; null when n = 0. */
  bias_mg_l: number | null;
  /** Nash–Sutcliffe efficiency 1 − Σ(o − m)²/Σ(o − ō)²; null when n < 2 or the observations do not vary. */
  nse: number | null;
}

export interface SurveyResiduals {
  /** One row per sample with a DO value, in the survey's order. */
  rows: ResidualRow[];
  /** Samples of the survey without a DO value (left out of `rows`). */
  withoutDo: number;
  /** Over the rows on the run's network. */
  statistics: FitStatistics;
}

/**
 * How far past a reach's length in the run a sample's km may lie and still be read at the
 * reach's end, km: the rounding slack survey placement allows a given km (1 m, as
 * lib/survey/place-stations.ts), so a km written to the metre is not turned away.
 */
export const KM_SLACK = 1e-3;

/**
 * Modelled DO at `km` from the reach head, mg/L, by linear interpolation between the
 * reach's profile points (in order of km, as the model reports them); null when km lies
 * before the head or more than KM_SLACK past the last point. At an outfall the model gives
 * two points at one km (before and after mixing): the value there is the one after mixing,
 * as the calibration's exact DO takes it (the segment below the outfall).
 * Example: points (0, 8), (2, 7): doAlongReach(points, 0.5) → 7.75.
 */
export function doAlongReach(points: readonly ProfileDoPoint[], km: number): number | null {
  if (points.length === 0 || !Number.isFinite(km) || km < 0) return null;
  const last = points[points.length - 1];
  if (km > last.km + KM_SLACK) return null;
  if (km >= last.km) return last.do_mg_l;
  // the last point at or before km: after mixing where two share an outfall's km
  let i = -1;
  for (let j = 0; j < points.length && points[j].km <= km; j++) i = j;
  if (i < 0) return null;
  const a = points[i];
  const b = points[i + 1];
  return a.do_mg_l + ((km - a.km) / (b.km - a.km)) * (b.do_mg_l - a.do_mg_l);
}

/**
 * RMSE, bias (mean of modelled − observed) and Nash–Sutcliffe efficiency of paired values,
 * mg/L. The same definitions as lib/calibration/calibrate.ts, which computes them inline
 * and exports no helper. Example: observed [9, 7, 7], modelled [8.5, 7.5, 6.5] →
 * { n: 3, rmse_mg_l: 0.5, bias_mg_l: −1/6, nse: 23/32 }.
 */
export function fitStatistics(pairs: ReadonlyArray<{ observed: number; modelled: number }>): FitStatistics {
  const n = pairs.length;
  if (n === 0) return { n, rmse_mg_l: null, bias_mg_l: null, nse: null };
  const sse = pairs.reduce((s, p) => s + (p.observed - p.modelled) ** 2, 0);
  const bias = pairs.reduce((s, p) => s + (p.modelled - p.observed), 0) / n;
  const mean = pairs.reduce((s, p) => s + p.observed, 0) / n;
  const spread = pairs.reduce((s, p) => s + (p.observed - mean) ** 2, 0);
  return { n, rmse_mg_l: Math.sqrt(sse / n), bias_mg_l: bias, nse: n >= 2 && spread > 0 ? 1 - sse / spread : null };
}

/**
 * Each sample with a DO value against the run's DO under one condition: on a reach of the
 * run and within its length, the modelled DO there (doAlongReach) and the residual; on a
 * reach the run does not have, or past its length, a row that says so (never dropped).
 * Statistics over the rows on the network.
 */
export function surveyResiduals(run: Pick<RunResult, "reaches">, samples: readonly SurveySampleInput[]): SurveyResiduals {
  const byReach = new Map(run.reaches.map((r) => [r.id, r.points]));
  const rows: ResidualRow[] = [];
  let withoutDo = 0;
  for (const s of samples) {
    if (s.do_mg_l === null || !Number.isFinite(s.do_mg_l)) {
      withoutDo++;
      continue;
    }
    const base = { station: s.station, time: s.time, reach: s.reach, km: s.km, observed_mg_l: s.do_mg_l };
    const points = byReach.get(s.reach);
    const modelled = points ? doAlongReach(points, s.km) : null;
    if (modelled === null) {
      rows.push({ ...base, onNetwork: false, why: points ? "beyond" : "reach", modelled_mg_l: null, residual_mg_l: null });
    } else {
      rows.push({ ...base, onNetwork: true, modelled_mg_l: modelled, residual_mg_l: s.do_mg_l - modelled });
    }
  }
  const matched = rows.filter((r): r is MatchedRow => r.onNetwork);
  return { rows, withoutDo, statistics: fitStatistics(matched.map((r) => ({ observed: r.observed_mg_l, modelled: r.modelled_mg_l }))) };
}

/** An observed sample placed on a profile chart's distance axis. */
export interface ObservedPoint {
  station: string;
  time: string | null;
  reach: string;
  km: number;
  /** Distance from the head of the series' path, in the series' unit. */
  distance: number;
  do_mg_l: number;
  modelled_mg_l: number;
  residual_mg_l: number;
}

/**
 * The matched rows that lie on the series' path, at their distance along it (the reach's
 * start on the axis plus the sample's km, in the series' unit), in order of distance.
 * Rows on reaches off the path are left out: they belong to another path's chart.
 * Example: path R1 (3 km) → R2, a sample 1 km down R2 → distance 4 (km) or 4/1.609344 (mi).
 */
export function observedOnPath(series: Pick<ProfileSeries, "unit" | "reaches">, rows: readonly ResidualRow[]): ObservedPoint[] {
  const starts = new Map(series.reaches.map((r) => [r.id, r.from]));
  const toUnit = (km: number) => (series.unit === "mi" ? kmToMi(km) : km);
  const out: ObservedPoint[] = [];
  for (const r of rows) {
    const from = starts.get(r.reach);
    if (!r.onNetwork || from === undefined) continue;
    out.push({
      station: r.station,
      time: r.time,
      reach: r.reach,
      km: r.km,
      distance: from + toUnit(r.km),
      do_mg_l: r.observed_mg_l,
      modelled_mg_l: r.modelled_mg_l,
      residual_mg_l: r.residual_mg_l,
    });
  }
  return out.sort((a, b) => a.distance - b.distance);
}
