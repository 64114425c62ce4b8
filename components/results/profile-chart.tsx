"use client";
import { useEffect, useMemo, useRef, useState, type RefObject } from "react";
import {
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { DO_BAND_COLOURS, doBand, formatDo } from "@/lib/results/do-scale";
import { clearestBox, staggerLabels, textWidthPx } from "@/lib/results/chart-labels";
import { anoxicStretches, type ProfileSeries, type SeriesPoint } from "@/lib/results/profile-series";
import type { ObservedPoint } from "@/lib/results/survey-residuals";

const INK = "#1d2a33";
const FAINT = "#6f7d86";
const RULE = "#d9d6cc";
/** Observed samples: filled dots, apart from the hollow diamonds of the critical points. */
const OBSERVED = "#1d2a33";

/** Observed DO of a survey, drawn beside the modelled line: the points on this chart's path, and the legend's name. */
export interface ObservedOnChart {
  label: string;
  points: ObservedPoint[];
}

type Critical = ProfileSeries["criticals"][number];

function CriticalMark({ cx, cy, payload, criterion }: { cx?: number; cy?: number; payload?: Critical; criterion: number }) {
  if (cx === undefined || cy === undefined || !payload) return null;
  const colour = DO_BAND_COLOURS[doBand(payload.do_mg_l, criterion)];
  const r = payload.below ? 7 : 5.5;
  // a diamond, so critical points read differently from the line's own points
  return <path d={`M${cx},${cy - r} L${cx + r},${cy} L${cx},${cy + r} L${cx - r},${cy} Z`} fill="#ffffff" stroke={colour} strokeWidth={2.5} />;
}

function ObservedMark({ cx, cy, payload }: { cx?: number; cy?: number; payload?: ObservedPoint }) {
  if (cx === undefined || cy === undefined || !payload) return null;
  return <circle cx={cx} cy={cy} r={4.5} fill={OBSERVED} stroke="#ffffff" strokeWidth={1.5} data-testid="observed-point" data-station={payload.station} />;
}

function ProfileTooltip({ active, payload, unit }: { active?: boolean; payload?: ReadonlyArray<{ payload?: unknown }>; unit: string }) {
  const p = active ? (payload?.[0]?.payload as (SeriesPoint & Partial<Critical>) | ObservedPoint | undefined) : undefined;
  if (!p) return null;
  if ("station" in p) {
    return (
      <div className="rounded-md border border-rule bg-paper-raised px-3 py-2 text-xs shadow">
        <p className="font-semibold">
          Station {p.station} ({p.reach})
        </p>
        <p>
          {p.distance.toFixed(2)} {unit} along the path{p.time ? `, ${p.time.replace("T", " ")}` : ""}
        </p>
        <p>Observed DO {formatDo(p.do_mg_l)} mg/L</p>
        <p>Modelled {p.modelled_mg_l < 0 ? "anoxic" : `${formatDo(p.modelled_mg_l)} mg/L`}</p>
      </div>
    );
  }
  const isCritical = "below" in p;
  return (
    <div className="rounded-md border border-rule bg-paper-raised px-3 py-2 text-xs shadow">
      <p className="font-semibold">
        {isCritical ? "Critical point of " : "Reach "}
        {p.reach}
      </p>
      <p>
        {p.distance.toFixed(2)} {unit} along the path
      </p>
      <p>DO {p.do_mg_l < 0 ? "anoxic" : `${formatDo(p.do_mg_l)} mg/L`}</p>
      {!isCritical && <p>Saturation {formatDo(p.do_sat_mg_l)} mg/L</p>}
    </div>
  );
}

/** The chart's margins and recharts' default axis sizes, px: where the plot sits inside the svg. */
const MARGIN = { top: 44, right: 24, bottom: 28, left: 8 };
const Y_AXIS_WIDTH = 60;
const X_AXIS_HEIGHT = 30;
const LABEL_FONT_PX = 11;
const REACH_FONT_PX = 10;
const ROW_PX = 15;
/** A white edge under chart text, so a grid or reference line crossing it does not cut the letters. */
const TEXT_HALO = { stroke: "#ffffff", strokeWidth: 3, strokeLinejoin: "round" as const, paintOrder: "stroke" as const };

/** The width the chart is drawn at, px (0 before the first layout). */
function useWidth(): [RefObject<HTMLDivElement | null>, number] {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => setWidth(entry.contentRect.width));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}

interface Layout {
  /** Discharger id → row above the plot (0 nearest), or null when thinned out. */
  dischargerRows: Map<string, number | null>;
  /** Reach ids shown at their boundary (the others thinned out). */
  reachIds: Set<string>;
  /** The criterion label's box, px from the plot's left and from the criterion line (negative: above it). */
  criterion: { left: number; dy: number; width: number; anchor: "start" | "end" };
}

/**
 * Where the labels go at this width: discharger ids staggered in two rows above the plot
 * (thinned when even two rows have no room), reach ids in one row (thinned), and the
 * criterion label in the first spot along its line that no DO point or critical mark is in.
 */
function layoutLabels(series: ProfileSeries, top: number, width: number, height: number, observed: readonly ObservedPoint[] = []): Layout {
  const plotW = Math.max(1, width - MARGIN.left - Y_AXIS_WIDTH - MARGIN.right);
  const plotH = Math.max(1, height - MARGIN.top - MARGIN.bottom - X_AXIS_HEIGHT);
  const length = series.length > 0 ? series.length : 1;
  const px = (d: number) => (d / length) * plotW;
  const py = (v: number) => plotH - (Math.max(0, v) / top) * plotH;
  const dischargers = staggerLabels(
    series.dischargers.map((d) => ({ id: d.id, x: px(d.distance), width: textWidthPx(d.id, LABEL_FONT_PX) })),
    { rows: 2, gap: 6, minX: 0, maxX: plotW },
  );
  const reaches = staggerLabels(
    series.reaches.slice(1).map((r) => {
      const w = textWidthPx(r.id, REACH_FONT_PX);
      return { id: r.id, x: px(r.from) + 3 + w / 2, width: w };
    }),
    { rows: 1, gap: 6, maxX: plotW },
  );
  const text = criterionText(series.criterion_mg_l);
  const w = textWidthPx(text, LABEL_FONT_PX) + 4;
  const y = py(series.criterion_mg_l);
  const marks = [
    ...series.points.flatMap((p) => [
      { x: px(p.distance), y: py(p.do_shown_mg_l) },
      { x: px(p.distance), y: py(p.do_sat_mg_l) },
    ]),
    ...series.criticals.map((c) => ({ x: px(c.distance), y: py(c.do_shown_mg_l) })),
    ...observed.map((o) => ({ x: px(o.distance), y: py(o.do_mg_l) })),
  ];
  const spots = [plotW - w - 4, 4, plotW * 0.75 - w / 2, plotW * 0.5 - w / 2, plotW * 0.25 - w / 2].flatMap((left) =>
    [3, -ROW_PX - 3].map((dy) => ({ left, top: y + dy, width: w, height: ROW_PX, dy })),
  );
  const best = clearestBox(spots, marks, 4);
  return {
    dischargerRows: new Map(dischargers.map((d) => [d.id, d.row])),
    reachIds: new Set(reaches.filter((r) => r.row !== null).map((r) => r.id)),
    criterion: { left: best.left, dy: best.dy, width: w, anchor: "start" },
  };
}

const criterionText = (mgL: number) => `criterion ${mgL.toFixed(1)} mg/L`;

interface LineLabelProps {
  viewBox?: { x?: number; y?: number; width?: number; height?: number };
}

/**
 * DO versus distance along a path to the outlet: the DO line (anoxic stretches shaded
 * and drawn at zero), saturation, the criterion, dischargers as labelled verticals,
 * reach boundaries, and each reach's exact critical point as a diamond. Labels are laid
 * out for the width drawn (staggered, thinned, the criterion's kept off the data); the
 * key sits under the chart, clear of the plot. With `observed`, a survey's samples on the
 * path are dots beside the line, named in the key.
 */
export function ProfileChart({ series, height = 360, observed }: { series: ProfileSeries; height?: number; observed?: ObservedOnChart }) {
  const criterion = series.criterion_mg_l;
  const observedPoints = observed?.points;
  const top = Math.ceil(Math.max(criterion + 1, ...series.points.map((p) => p.do_sat_mg_l), ...(observedPoints ?? []).map((o) => o.do_mg_l)) + 0.5);
  const [ref, width] = useWidth();
  const layout = useMemo(() => layoutLabels(series, top, width, height, observedPoints), [series, top, width, height, observedPoints]);
  return (
    <div data-testid="profile-chart" className="w-full" role="img" aria-label={`DO profile from ${series.origin ?? series.path[0]} to the outlet`}>
      <div ref={ref} className="w-full" style={{ height }}>
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={series.points} margin={MARGIN}>
            <CartesianGrid stroke={RULE} strokeDasharray="2 4" />
            <XAxis
              type="number"
              dataKey="distance"
              domain={[0, series.length]}
              tickFormatter={(v: number) => v.toFixed(1)}
              label={{ value: `Distance from ${series.origin ?? `the head of ${series.path[0]}`} (${series.unit})`, position: "insideBottom", offset: -16, fill: FAINT }}
              stroke={FAINT}
              height={X_AXIS_HEIGHT}
            />
            <YAxis
              type="number"
              domain={[0, top]}
              allowDataOverflow
              label={{ value: "Dissolved oxygen (mg/L)", angle: -90, position: "insideLeft", offset: 16, fill: FAINT, style: { textAnchor: "middle" } }}
              stroke={FAINT}
              width={Y_AXIS_WIDTH}
            />
            {anoxicStretches(series).map((s) => (
              <ReferenceArea key={`anoxic-${s.from}`} x1={s.from} x2={Math.max(s.to, s.from + series.length / 400)} y1={0} y2={top} fill={INK} fillOpacity={0.12} label={{ value: "anoxic", fill: INK, position: "center" }} />
            ))}
            {series.reaches.slice(1).map((r) => (
              <ReferenceLine
                key={`reach-${r.id}`}
                x={r.from}
                stroke={RULE}
                strokeWidth={1.5}
                label={layout.reachIds.has(r.id) ? { value: r.id, position: "insideTopLeft", fill: FAINT, fontSize: REACH_FONT_PX } : undefined}
              />
            ))}
            {series.dischargers.map((d) => {
              const row = layout.dischargerRows.get(d.id);
              return (
                <ReferenceLine
                  key={`discharger-${d.id}`}
                  x={d.distance}
                  stroke={INK}
                  strokeDasharray="4 3"
                  label={
                    row === null || row === undefined
                      ? undefined
                      : ({ viewBox }: LineLabelProps) => (
                          <text x={viewBox?.x ?? 0} y={(viewBox?.y ?? MARGIN.top) - 5 - row * ROW_PX} textAnchor="middle" fill={INK} fontSize={LABEL_FONT_PX} {...TEXT_HALO} data-label="discharger">
                            {d.id}
                          </text>
                        )
                  }
                />
              );
            })}
            <ReferenceLine
              y={criterion}
              stroke={DO_BAND_COLOURS.below}
              strokeWidth={1.5}
              strokeDasharray="6 3"
              label={({ viewBox }: LineLabelProps) => (
                <text
                  x={(viewBox?.x ?? 0) + layout.criterion.left + 2}
                  y={(viewBox?.y ?? 0) + layout.criterion.dy + ROW_PX - 3}
                  textAnchor={layout.criterion.anchor}
                  fill={DO_BAND_COLOURS.below}
                  fontSize={LABEL_FONT_PX}
                  {...TEXT_HALO}
                  data-label="criterion"
                >
                  {criterionText(criterion)}
                </text>
              )}
            />
            <Line name="DO saturation" dataKey="do_sat_mg_l" stroke="#7fb1ae" strokeDasharray="5 4" dot={false} isAnimationActive={false} type="linear" />
            <Line name="DO" dataKey="do_shown_mg_l" stroke="#245659" strokeWidth={2.25} dot={false} isAnimationActive={false} type="linear" />
            <Scatter
              name="critical point"
              data={series.criticals}
              dataKey="do_shown_mg_l"
              fill={FAINT}
              stroke={INK}
              isAnimationActive={false}
              shape={(props: unknown) => <CriticalMark {...(props as { cx?: number; cy?: number; payload?: Critical })} criterion={criterion} />}
            />
            {observed && (
              <Scatter
                name={`Observed (${observed.label})`}
                data={observed.points}
                dataKey="do_mg_l"
                fill={OBSERVED}
                isAnimationActive={false}
                shape={(props: unknown) => <ObservedMark {...(props as { cx?: number; cy?: number; payload?: ObservedPoint })} />}
              />
            )}
            <Tooltip content={({ active, payload }) => <ProfileTooltip active={active} payload={payload} unit={series.unit} />} />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <ProfileKey criterion={criterion} thinned={[...layout.dischargerRows.values()].some((r) => r === null)} observed={observed?.label} />
    </div>
  );
}

/** The chart's key, under it so it never covers a label or the data. */
function ProfileKey({ criterion, thinned, observed }: { criterion: number; thinned: boolean; observed?: string }) {
  const line = (stroke: string, dash?: string, w = 2) => (
    <svg width="26" height="10" aria-hidden>
      <line x1="1" y1="5" x2="25" y2="5" stroke={stroke} strokeWidth={w} strokeDasharray={dash} />
    </svg>
  );
  return (
    <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 pl-2 text-xs text-ink-soft" data-testid="profile-key">
      <li className="flex items-center gap-1.5">{line("#245659", undefined, 2.25)}DO</li>
      <li className="flex items-center gap-1.5">{line("#7fb1ae", "5 4")}DO saturation</li>
      <li className="flex items-center gap-1.5">{line(DO_BAND_COLOURS.below, "6 3", 1.5)}criterion {criterion.toFixed(1)} mg/L</li>
      <li className="flex items-center gap-1.5">
        <svg width="14" height="14" aria-hidden>
          <path d="M7,1.5 L12.5,7 L7,12.5 L1.5,7 Z" fill="#ffffff" stroke={FAINT} strokeWidth={2} />
        </svg>
        critical point of a reach
      </li>
      <li className="flex items-center gap-1.5">{line(INK, "4 3", 1)}discharger{thinned ? " (ids left out where they would overlap; a wider window shows them)" : ""}</li>
      {observed !== undefined && (
        <li className="flex items-center gap-1.5" data-testid="observed-key">
          <svg width="14" height="14" aria-hidden>
            <circle cx="7" cy="7" r="4.5" fill={OBSERVED} stroke="#ffffff" strokeWidth={1.5} />
          </svg>
          Observed ({observed})
        </li>
      )}
    </ul>
  );
}
