import type { UnitSystem } from "@/lib/domain";
import { kmToMi } from "@/lib/model/units";
import type { RunResult } from "@/lib/model/network/run";
import type { ModelFile } from "@/lib/model/types";
import { isBelowCriterion } from "./do-scale";
import { pathToOutlet } from "./path";

export type DistanceUnit = "km" | "mi";

/** km or mi for the basin's unit system. */
export const distanceUnit = (system: UnitSystem): DistanceUnit => (system === "US" ? "mi" : "km");
const toUnit = (km: number, unit: DistanceUnit) => (unit === "mi" ? kmToMi(km) : km);

export interface SeriesPoint {
  reach: string;
  /** km from the reach head (model output). */
  km: number;
  /** Distance from the head of the path, in the series' unit. */
  distance: number;
  /** Distance to the outlet, in the series' unit. */
  to_outlet: number;
  t_day: number;
  /** DO as computed (may be below zero). */
  do_mg_l: number;
  /** DO for drawing: never below zero. */
  do_shown_mg_l: number;
  anoxic: boolean;
  do_sat_mg_l: number;
  criterion_mg_l: number;
}

export interface SeriesMarker {
  reach: string;
  km: number;
  distance: number;
}

export interface ProfileSeries {
  unit: DistanceUnit;
  path: string[];
  criterion_mg_l: number;
  /** Where each reach of the path starts and ends on the distance axis. */
  reaches: Array<{ id: string; from: number; to: number }>;
  points: SeriesPoint[];
  dischargers: Array<SeriesMarker & { id: string }>;
  criticals: Array<SeriesMarker & { do_mg_l: number; do_shown_mg_l: number; anoxic: boolean; below: boolean }>;
  /** Length of the path, in the series' unit. */
  length: number;
  /** What distance 0 is, when not the head of the path's first reach (e.g. "outfall DP-1"). */
  origin?: string;
}

/**
 * DO versus distance along the path from `startReach` to the outlet: every profile point
 * of every reach on the path, its saturation and the criterion, with the path's
 * dischargers and each reach's exact critical point on the same distance axis
 * (distance from the head of `startReach`, km or mi). Throws for an unknown reach or a
 * reach missing from the run.
 */
export function profileSeries(run: RunResult, model: ModelFile, startReach: string, system: UnitSystem = "SI"): ProfileSeries {
  const unit = distanceUnit(system);
  const path = pathToOutlet(model, startReach);
  const lengths = new Map(model.reaches.map((r) => [r.id, r.length_km]));
  const results = new Map(run.reaches.map((r) => [r.id, r]));
  const criterion = run.criterion_do_mg_l;
  const out: ProfileSeries = { unit, path, criterion_mg_l: criterion, reaches: [], points: [], dischargers: [], criticals: [], length: 0 };
  const totalKm = path.reduce((s, id) => s + (lengths.get(id) ?? 0), 0);
  let headKm = 0;
  for (const id of path) {
    const r = results.get(id);
    if (!r) throw new RangeError(`Reach "${id}" is not in the run result`);
    const at = (km: number) => toUnit(headKm + km, unit);
    const lengthKm = lengths.get(id) ?? 0;
    out.reaches.push({ id, from: at(0), to: at(lengthKm) });
    for (const p of r.points) {
      out.points.push({
        reach: id,
        km: p.km,
        distance: at(p.km),
        to_outlet: toUnit(p.km_to_outlet, unit),
        t_day: p.t_day,
        do_mg_l: p.do_mg_l,
        do_shown_mg_l: Math.max(0, p.do_mg_l),
        anoxic: p.do_mg_l < 0,
        do_sat_mg_l: p.do_sat_mg_l,
        criterion_mg_l: criterion,
      });
    }
    for (const d of model.dischargers) if (d.reach === id) out.dischargers.push({ id: d.id, reach: id, km: d.km, distance: at(d.km) });
    const c = r.critical;
    out.criticals.push({
      reach: id,
      km: c.km,
      distance: at(c.km),
      do_mg_l: c.do_mg_l,
      do_shown_mg_l: Math.max(0, c.do_mg_l),
      anoxic: c.do_mg_l < 0,
      below: isBelowCriterion(c.do_mg_l, criterion),
    });
    headKm += lengthKm;
  }
  out.dischargers.sort((a, b) => a.distance - b.distance);
  out.length = toUnit(totalKm, unit);
  return out;
}

/**
 * Stretches of the series where DO is below zero, as [from, to] on its distance axis
 * (the chart shades them as anoxic). A stretch runs from its first anoxic point to its last.
 */
export function anoxicStretches(series: Pick<ProfileSeries, "points">): Array<{ from: number; to: number }> {
  const out: Array<{ from: number; to: number }> = [];
  let open: { from: number; to: number } | null = null;
  for (const p of series.points) {
    if (p.anoxic) {
      if (open) open.to = p.distance;
      else open = { from: p.distance, to: p.distance };
    } else if (open) {
      out.push(open);
      open = null;
    }
  }
  if (open) out.push(open);
  return out;
}

/**
 * The part of a series at and below one outfall (a discharger on the path), with
 * distances measured from the outfall: what a discharger's load does downstream.
 * The first reach's critical point is kept only when it lies below the outfall.
 * Also returns the lowest DO on that stretch and where it is. Throws when the
 * discharger is not on the series' path.
 */
export function downstreamOf(series: ProfileSeries, dischargerId: string) {
  const outfall = series.dischargers.find((d) => d.id === dischargerId);
  if (!outfall) throw new RangeError(`Discharger "${dischargerId}" is not on the path from ${series.path[0]}`);
  const at = outfall.distance;
  const shift = <T extends { distance: number }>(x: T): T => ({ ...x, distance: x.distance - at });
  const points = series.points.filter((p) => p.distance >= at - 1e-9).map(shift);
  const lowest = points.reduce<SeriesPoint | null>((low, p) => (low === null || p.do_mg_l < low.do_mg_l ? p : low), null);
  const out: ProfileSeries = {
    ...series,
    reaches: series.reaches.filter((r) => r.to > at + 1e-9).map((r) => ({ id: r.id, from: Math.max(0, r.from - at), to: r.to - at })),
    points,
    dischargers: series.dischargers.filter((d) => d.distance >= at - 1e-9).map(shift),
    criticals: series.criticals.filter((c) => c.distance >= at - 1e-9).map(shift),
    length: series.length - at,
    origin: `outfall ${dischargerId}`,
  };
  return { series: out, lowest };
}

/** One run's DO line on an overlay chart. */
export interface OverlayLine {
  label: string;
  /** The condition the line is under. */
  condition: string;
  points: Array<{ distance: number; do_shown_mg_l: number; do_mg_l: number; reach: string }>;
  /** Lowest DO on the path and where (distance in the overlay's unit). */
  lowest: { do_mg_l: number; distance: number; reach: string };
}

export interface ProfileOverlay {
  unit: DistanceUnit;
  path: string[];
  length: number;
  /** Criteria of the runs (one value when they agree). */
  criteria_mg_l: number[];
  reaches: ProfileSeries["reaches"];
  dischargers: ProfileSeries["dischargers"];
  lines: OverlayLine[];
  /** Runs left out because the start reach or its path is not in their network. */
  skipped: string[];
}

/**
 * DO profiles of several runs along one path, on one distance axis, for overlaying: each
 * run's series from `startReach` (profileSeries), the reach bounds and dischargers from the
 * first run that has the path. A run whose model lacks the start reach, or whose path
 * differs, is listed in `skipped` rather than drawn on a wrong axis.
 */
export function profileOverlay(
  runs: Array<{ label: string; condition: string; run: RunResult; model: ModelFile }>,
  startReach: string,
  system: UnitSystem = "SI",
): ProfileOverlay {
  const out: ProfileOverlay = { unit: distanceUnit(system), path: [], length: 0, criteria_mg_l: [], reaches: [], dischargers: [], lines: [], skipped: [] };
  for (const r of runs) {
    let s: ProfileSeries;
    try {
      s = profileSeries(r.run, r.model, startReach, system);
    } catch {
      out.skipped.push(r.label);
      continue;
    }
    if (out.lines.length === 0) {
      out.path = s.path;
      out.length = s.length;
      out.reaches = s.reaches;
      out.dischargers = s.dischargers;
    } else if (s.path.join("›") !== out.path.join("›")) {
      out.skipped.push(r.label);
      continue;
    }
    if (!out.criteria_mg_l.includes(s.criterion_mg_l)) out.criteria_mg_l.push(s.criterion_mg_l);
    const low = s.points.reduce((a, p) => (p.do_mg_l < a.do_mg_l ? p : a), s.points[0]);
    // the exact critical points belong on the line too: the lowest DO is often between profile points
    const points = [...s.points.map((p) => ({ distance: p.distance, do_shown_mg_l: p.do_shown_mg_l, do_mg_l: p.do_mg_l, reach: p.reach }))];
    for (const c of s.criticals) {
      // a critical point at a profile point (a segment end) is already on the line
      if (!s.points.some((p) => Math.abs(p.distance - c.distance) < 1e-9)) points.push({ distance: c.distance, do_shown_mg_l: c.do_shown_mg_l, do_mg_l: c.do_mg_l, reach: c.reach });
    }
    points.sort((a, b) => a.distance - b.distance);
    const crit = s.criticals.reduce((a, c) => (c.do_mg_l < a.do_mg_l ? c : a), s.criticals[0]);
    const lowest = crit && crit.do_mg_l < low.do_mg_l ? crit : low;
    out.lines.push({ label: r.label, condition: r.condition, points, lowest: { do_mg_l: lowest.do_mg_l, distance: lowest.distance, reach: lowest.reach } });
  }
  return out;
}
