import type { FeatureCollection, LineString, Point, Position } from "geojson";
import { geodesicMetres } from "@/geo/geodesic";
import { textWidthPx, type Box } from "@/lib/results/chart-labels";
import { DO_BAND_COLOURS, doLegend, type DoBand } from "@/lib/results/do-scale";
import type { ProfileSeries } from "@/lib/results/profile-series";
import type { PieceProperties } from "@/lib/results/results-geojson";
import { scaleBar, type ScaleBar } from "./scale-bar";

/** Drawing box of a figure, in PDF points. */
export interface FigureBox {
  width: number;
  height: number;
  /** Room for axis labels: left, bottom; top and right get a small fixed margin. */
  left?: number;
  bottom?: number;
}

export interface Tick {
  at: number;
  label: string;
}

/** A DO-versus-distance chart already scaled to the box (all coordinates in points). */
export interface ProfileFigure {
  width: number;
  height: number;
  plot: { x: number; y: number; w: number; h: number };
  /** SVG points attribute "x,y x,y …" of the DO line (anoxic water drawn at 0). */
  doLine: string;
  saturationLine: string;
  criterionY: number;
  xTicks: Tick[];
  yTicks: Tick[];
  /** Where one reach of the path ends and the next begins. */
  reachBreaks: Array<{ x: number; id: string }>;
  dischargers: Array<{ x: number; id: string }>;
  lowest: { x: number; y: number; doMgL: number };
  xLabel: string;
  path: string[];
}

/** Round step for about `count` ticks over `span` (1, 2 or 5 × 10^n). */
export function niceStep(span: number, count = 5): number {
  if (!(span > 0)) return 1;
  const raw = span / count;
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

const pts = (xy: Array<[number, number]>) => xy.map(([x, y]) => `${x.toFixed(1)},${y.toFixed(1)}`).join(" ");

/**
 * The profile series scaled into a figure box: y from 0 mg/L to the next whole mg/L
 * above the highest of DO, saturation and the criterion; x from the head of the path
 * to the outlet. Throws when the series has no points.
 */
export function profileFigure(series: ProfileSeries, box: FigureBox): ProfileFigure {
  if (series.points.length === 0) throw new RangeError("The profile has no points to draw");
  const left = box.left ?? 34;
  const bottom = box.bottom ?? 26;
  const plot = { x: left, y: 14, w: box.width - left - 8, h: box.height - bottom - 14 };
  const xMax = series.length > 0 ? series.length : 1;
  const yTop = Math.ceil(Math.max(series.criterion_mg_l, ...series.points.map((p) => Math.max(p.do_shown_mg_l, p.do_sat_mg_l))) + 0.5);
  const sx = (d: number) => plot.x + (d / xMax) * plot.w;
  const sy = (mgL: number) => plot.y + plot.h - (Math.max(0, mgL) / yTop) * plot.h;
  const xStep = niceStep(xMax);
  const xTicks: Tick[] = [];
  for (let d = 0; d <= xMax + 1e-9; d += xStep) xTicks.push({ at: sx(d), label: Number(d.toFixed(6)).toString() });
  const yStep = niceStep(yTop, 5);
  const yTicks: Tick[] = [];
  for (let v = 0; v <= yTop + 1e-9; v += yStep) yTicks.push({ at: sy(v), label: Number(v.toFixed(6)).toString() });
  const low = series.points.reduce((a, p) => (p.do_mg_l < a.do_mg_l ? p : a));
  return {
    width: box.width,
    height: box.height,
    plot,
    doLine: pts(series.points.map((p) => [sx(p.distance), sy(p.do_shown_mg_l)])),
    saturationLine: pts(series.points.map((p) => [sx(p.distance), sy(p.do_sat_mg_l)])),
    criterionY: sy(series.criterion_mg_l),
    xTicks,
    yTicks,
    reachBreaks: series.reaches.slice(0, -1).map((r) => ({ x: sx(r.to), id: r.id })),
    dischargers: series.dischargers.map((d) => ({ x: sx(d.distance), id: d.id })),
    lowest: { x: sx(low.distance), y: sy(low.do_shown_mg_l), doMgL: low.do_mg_l },
    xLabel: `Distance from the head of ${series.path[0]} (${series.unit})`,
    path: series.path,
  };
}

/** Reach pieces of a results map projected into a box, coloured by their DO band, with the outfalls, a scale bar and north. */
export interface MapFigure {
  width: number;
  height: number;
  lines: Array<{ points: string; colour: string; band: DoBand }>;
  /** Dischargers at their outfalls; `label` is where the permit id goes (null: left out, no room clear of the others). */
  outfalls: Array<{ id: string; x: number; y: number; label: { x: number; y: number; anchor: "start" | "end" | "middle" } | null }>;
  /** Bottom-left corner of the scale bars: kilometres above, miles below. */
  scale: { x: number; y: number; metric: ScaleBar; imperial: ScaleBar };
  /** Tip of the north arrow (the drawing is north up). */
  north: { x: number; y: number };
  legend: Array<{ colour: string; label: string }>;
}

const OUTFALL_FONT_PT = 6;

/**
 * Where each outfall's permit id goes: right of the dot, else left, above or below,
 * the first spot inside the box that overlaps no label placed before it; none when
 * every spot is taken (the dot is still drawn). Boxes in points.
 */
function placeOutfallLabels(points: Array<{ id: string; x: number; y: number }>, box: { width: number; height: number }, reserved: Box[]): MapFigure["outfalls"] {
  const taken: Box[] = [...reserved];
  const h = OUTFALL_FONT_PT + 1;
  return points.map((p) => {
    const w = textWidthPx(p.id, OUTFALL_FONT_PT);
    const spots = [
      { left: p.x + 4, top: p.y - h / 2, anchor: "start" as const, tx: p.x + 4, ty: p.y + h / 2 - 1.5 },
      { left: p.x - 4 - w, top: p.y - h / 2, anchor: "end" as const, tx: p.x - 4, ty: p.y + h / 2 - 1.5 },
      { left: p.x - w / 2, top: p.y - 4 - h, anchor: "middle" as const, tx: p.x, ty: p.y - 5.5 },
      { left: p.x - w / 2, top: p.y + 4, anchor: "middle" as const, tx: p.x, ty: p.y + 4 + h - 1.5 },
    ].map((s) => ({ ...s, width: w, height: h }));
    const fits = spots.find(
      (s) => s.left >= 1 && s.top >= 1 && s.left + s.width <= box.width - 1 && s.top + s.height <= box.height - 1 && !taken.some((t) => overlaps(s, t)),
    );
    if (!fits) return { ...p, label: null };
    taken.push(fits);
    return { ...p, label: { x: fits.tx, y: fits.ty, anchor: fits.anchor } };
  });
}

const overlaps = (a: Box, b: Box) => a.left < b.left + b.width && b.left < a.left + a.width && a.top < b.top + b.height && b.top < a.top + a.height;

/**
 * The reach pieces and dischargers of `resultsGeoJson` drawn in a box: longitude scaled
 * by the cosine of the mean latitude (a plain equirectangular view, adequate at basin
 * scale), north up, the drawing centred and uniformly scaled to fit; outfalls with their
 * permit ids (thinned where they would overlap), scale bars in km and mi (their length
 * from the WGS84 geodesic along the drawing's central meridian) and a north arrow.
 * Null when there is no piece to draw.
 */
export function mapFigure(results: FeatureCollection, criterionMgL: number, box: { width: number; height: number }): MapFigure | null {
  const pieces = results.features.filter((f) => f.properties?.kind === "reach-piece" && f.geometry?.type === "LineString");
  const all: Position[] = pieces.flatMap((f) => (f.geometry as LineString).coordinates);
  if (all.length < 2) return null;
  const lats = all.map((p) => p[1]);
  const k = Math.cos((((Math.min(...lats) + Math.max(...lats)) / 2) * Math.PI) / 180);
  const xs = all.map((p) => p[0] * k);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...lats), Math.max(...lats)];
  const pad = 6;
  const scale = Math.min((box.width - 2 * pad) / Math.max(x1 - x0, 1e-9), (box.height - 2 * pad) / Math.max(y1 - y0, 1e-9));
  const ox = (box.width - (x1 - x0) * scale) / 2;
  const oy = (box.height - (y1 - y0) * scale) / 2;
  const project = (p: Position): [number, number] => [ox + (p[0] * k - x0) * scale, box.height - (oy + (p[1] - y0) * scale)];
  // points per degree of latitude is `scale`; metres per degree from the geodesic along the middle meridian
  const midLon = (x0 + x1) / 2 / k;
  const span = Math.max(y1 - y0, 0.01);
  const midLat = (y0 + y1) / 2;
  const metresPerPoint = geodesicMetres([midLon, midLat - span / 2], [midLon, midLat + span / 2]) / (span * scale);
  const barRoom = box.width * 0.3;
  const scaleBox = { x: 6, y: box.height - 6, metric: scaleBar(metresPerPoint, barRoom), imperial: scaleBar(metresPerPoint, barRoom, "imperial") };
  const north = { x: box.width - 12, y: 6 };
  const reserved: Box[] = [
    { left: 0, top: box.height - 28, width: barRoom + 30, height: 28 },
    { left: box.width - 22, top: 0, width: 22, height: 30 },
  ];
  const dischargers = results.features
    .filter((f) => f.properties?.kind === "discharger" && f.geometry?.type === "Point")
    .map((f) => {
      const [x, y] = project((f.geometry as Point).coordinates);
      return { id: String(f.properties!.id), x: round1(x), y: round1(y) };
    })
    .sort((a, b) => a.x - b.x || a.y - b.y);
  return {
    width: box.width,
    height: box.height,
    lines: pieces.map((f) => {
      const band = (f.properties as PieceProperties).band;
      return { points: pts((f.geometry as LineString).coordinates.map(project)), colour: DO_BAND_COLOURS[band], band };
    }),
    outfalls: placeOutfallLabels(dischargers, box, reserved),
    scale: scaleBox,
    north,
    legend: doLegend(criterionMgL).map((s) => ({ colour: s.colour, label: s.label })),
  };
}

const round1 = (v: number) => Math.round(v * 10) / 10;
